import type { ComponentType } from 'react';
import { createBrowserRouter } from 'react-router-dom';
import { paths } from '../lib/paths';
import { RouteError } from './routes/route-error';

/**
 * Each page is its own chunk, loaded when it is first opened (React Router's lazy routes): the
 * sign-in page does not wait for the costing tables or the charts. The layouts are chunks too.
 */
function page<M extends Record<string, unknown>>(load: () => Promise<M>, name: keyof M & string) {
  return { lazy: async () => ({ Component: (await load())[name] as ComponentType }) };
}

export const router = createBrowserRouter([
  {
    errorElement: <RouteError />,
    children: [
      {
        ...page(() => import('./layout/auth-layout'), 'AuthLayout'),
        children: [
          { path: paths.signIn.path, ...page(() => import('./routes/sign-in'), 'SignInRoute') },
          { path: paths.signUp.path, ...page(() => import('./routes/sign-up'), 'SignUpRoute') },
          { path: paths.forgotPassword.path, ...page(() => import('./routes/forgot-password'), 'ForgotPasswordRoute') },
          { path: paths.resetPassword.path, ...page(() => import('./routes/reset-password'), 'ResetPasswordRoute') },
          { path: paths.acceptInvite.path, ...page(() => import('./routes/accept-invite'), 'AcceptInviteRoute') },
        ],
      },
      {
        // Signed-in pages: the layout checks the session and each section's roles.
        ...page(() => import('./layout/app-layout'), 'AppLayout'),
        children: [
          { path: paths.home.path, ...page(() => import('./routes/home'), 'HomeRoute') },
          { path: paths.gettingStarted.path, ...page(() => import('./routes/getting-started'), 'GettingStartedRoute') },
          { path: paths.team.path, ...page(() => import('./routes/team'), 'TeamRoute') },
          { path: paths.settings.path, ...page(() => import('./routes/settings'), 'SettingsRoute') },
          { path: paths.drinks.path, ...page(() => import('./routes/drinks'), 'DrinksRoute') },
          { path: paths.newDrink.path, ...page(() => import('./routes/drink-editor'), 'DrinkEditorRoute') },
          { path: paths.drink.path, ...page(() => import('./routes/drink-editor'), 'DrinkEditorRoute') },
          { path: paths.modifiers.path, ...page(() => import('./routes/modifiers'), 'ModifiersRoute') },
          { path: paths.newModifier.path, ...page(() => import('./routes/modifier'), 'ModifierRoute') },
          { path: paths.modifier.path, ...page(() => import('./routes/modifier'), 'ModifierRoute') },
          { path: paths.menuCosting.path, ...page(() => import('./routes/menu-costing'), 'MenuCostingRoute') },
          { path: paths.cards.path, ...page(() => import('./routes/cards'), 'CardsRoute') },
          { path: paths.card.path, ...page(() => import('./routes/card'), 'CardRoute') },
          { path: paths.ingredients.path, ...page(() => import('./routes/ingredients'), 'IngredientsRoute') },
          { path: paths.newIngredient.path, ...page(() => import('./routes/ingredient'), 'IngredientRoute') },
          { path: paths.ingredient.path, ...page(() => import('./routes/ingredient'), 'IngredientRoute') },
          { path: paths.preparations.path, ...page(() => import('./routes/preparations'), 'PreparationsRoute') },
          { path: paths.newPreparation.path, ...page(() => import('./routes/preparation'), 'PreparationRoute') },
          { path: paths.preparation.path, ...page(() => import('./routes/preparation'), 'PreparationRoute') },
          { path: paths.pricing.path, ...page(() => import('./routes/pricing'), 'PricingRoute') },
          { path: paths.repricing.path, ...page(() => import('./routes/repricing'), 'RepricingRoute') },
          { path: paths.priceList.path, ...page(() => import('./routes/price-list'), 'PriceListRoute') },
          { path: paths.priceHistory.path, ...page(() => import('./routes/price-history'), 'PriceHistoryRoute') },
          { path: paths.monthEnd.path, ...page(() => import('./routes/month-end'), 'MonthEndRoute') },
          { path: paths.stockCounts.path, ...page(() => import('./routes/stock-counts'), 'StockCountsRoute') },
          { path: paths.stockCount.path, ...page(() => import('./routes/stock-count'), 'StockCountRoute') },
          { path: paths.waste.path, ...page(() => import('./routes/waste'), 'WasteRoute') },
          { path: paths.tillSales.path, ...page(() => import('./routes/till-sales'), 'TillSalesRoute') },
          { path: paths.suppliers.path, ...page(() => import('./routes/suppliers'), 'SuppliersRoute') },
          { path: paths.newSupplier.path, ...page(() => import('./routes/supplier'), 'SupplierRoute') },
          { path: paths.supplier.path, ...page(() => import('./routes/supplier'), 'SupplierRoute') },
          { path: paths.stock.path, ...page(() => import('./routes/stock'), 'StockRoute') },
          { path: paths.orders.path, ...page(() => import('./routes/orders'), 'OrdersRoute') },
          { path: paths.newOrder.path, ...page(() => import('./routes/order-editor'), 'OrderEditorRoute') },
          { path: paths.order.path, ...page(() => import('./routes/order'), 'OrderRoute') },
          { path: paths.editOrder.path, ...page(() => import('./routes/order-editor'), 'OrderEditorRoute') },
          { path: paths.receiveOrder.path, ...page(() => import('./routes/order-receive'), 'OrderReceiveRoute') },
          { path: '*', ...page(() => import('./routes/not-found'), 'NotFoundRoute') },
        ],
      },
    ],
  },
]);
