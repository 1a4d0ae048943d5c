import { createBrowserRouter } from 'react-router-dom';
import { paths } from '../lib/paths';
import { AppLayout } from './layout/app-layout';
import { AuthLayout } from './layout/auth-layout';
import { RouteError } from './routes/route-error';
import { AcceptInviteRoute } from './routes/accept-invite';
import { ForgotPasswordRoute } from './routes/forgot-password';
import { GettingStartedRoute } from './routes/getting-started';
import { HomeRoute } from './routes/home';
import { NotFoundRoute } from './routes/not-found';
import { ResetPasswordRoute } from './routes/reset-password';
import { SettingsRoute } from './routes/settings';
import { SignInRoute } from './routes/sign-in';
import { SignUpRoute } from './routes/sign-up';
import { TeamRoute } from './routes/team';
import { MonthEndRoute } from './routes/month-end';
import { StockCountsRoute } from './routes/stock-counts';
import { StockCountRoute } from './routes/stock-count';
import { WasteRoute } from './routes/waste';
import { TillSalesRoute } from './routes/till-sales';
import { PriceHistoryRoute } from './routes/price-history';
import { PriceListRoute } from './routes/price-list';
import { RepricingRoute } from './routes/repricing';
import { CardRoute } from './routes/card';
import { CardsRoute } from './routes/cards';
import { DrinkEditorRoute } from './routes/drink-editor';
import { DrinksRoute } from './routes/drinks';
import { ModifierRoute } from './routes/modifier';
import { ModifiersRoute } from './routes/modifiers';
import { MenuCostingRoute } from './routes/menu-costing';
import { IngredientRoute } from './routes/ingredient';
import { IngredientsRoute } from './routes/ingredients';
import { PreparationRoute } from './routes/preparation';
import { PreparationsRoute } from './routes/preparations';
import { PricingRoute } from './routes/pricing';
import { SuppliersRoute } from './routes/suppliers';
import { SupplierRoute } from './routes/supplier';
import { StockRoute } from './routes/stock';
import { OrdersRoute } from './routes/orders';
import { OrderEditorRoute } from './routes/order-editor';
import { OrderRoute } from './routes/order';
import { OrderReceiveRoute } from './routes/order-receive';

export const router = createBrowserRouter([
  {
    errorElement: <RouteError />,
    children: [
      {
        element: <AuthLayout />,
        children: [
          { path: paths.signIn.path, element: <SignInRoute /> },
          { path: paths.signUp.path, element: <SignUpRoute /> },
          { path: paths.forgotPassword.path, element: <ForgotPasswordRoute /> },
          { path: paths.resetPassword.path, element: <ResetPasswordRoute /> },
          { path: paths.acceptInvite.path, element: <AcceptInviteRoute /> },
        ],
      },
      {
        // Signed-in pages: the layout checks the session and each section's roles.
        element: <AppLayout />,
        children: [
          { path: paths.home.path, element: <HomeRoute /> },
          { path: paths.gettingStarted.path, element: <GettingStartedRoute /> },
          { path: paths.team.path, element: <TeamRoute /> },
          { path: paths.settings.path, element: <SettingsRoute /> },
          { path: paths.drinks.path, element: <DrinksRoute /> },
          { path: paths.newDrink.path, element: <DrinkEditorRoute /> },
          { path: paths.drink.path, element: <DrinkEditorRoute /> },
          { path: paths.modifiers.path, element: <ModifiersRoute /> },
          { path: paths.newModifier.path, element: <ModifierRoute /> },
          { path: paths.modifier.path, element: <ModifierRoute /> },
          { path: paths.menuCosting.path, element: <MenuCostingRoute /> },
          { path: paths.cards.path, element: <CardsRoute /> },
          { path: paths.card.path, element: <CardRoute /> },
          { path: paths.ingredients.path, element: <IngredientsRoute /> },
          { path: paths.newIngredient.path, element: <IngredientRoute /> },
          { path: paths.ingredient.path, element: <IngredientRoute /> },
          { path: paths.preparations.path, element: <PreparationsRoute /> },
          { path: paths.newPreparation.path, element: <PreparationRoute /> },
          { path: paths.preparation.path, element: <PreparationRoute /> },
          { path: paths.pricing.path, element: <PricingRoute /> },
          { path: paths.repricing.path, element: <RepricingRoute /> },
          { path: paths.priceList.path, element: <PriceListRoute /> },
          { path: paths.priceHistory.path, element: <PriceHistoryRoute /> },
          { path: paths.monthEnd.path, element: <MonthEndRoute /> },
          { path: paths.stockCounts.path, element: <StockCountsRoute /> },
          { path: paths.stockCount.path, element: <StockCountRoute /> },
          { path: paths.waste.path, element: <WasteRoute /> },
          { path: paths.tillSales.path, element: <TillSalesRoute /> },
          { path: paths.suppliers.path, element: <SuppliersRoute /> },
          { path: paths.newSupplier.path, element: <SupplierRoute /> },
          { path: paths.supplier.path, element: <SupplierRoute /> },
          { path: paths.stock.path, element: <StockRoute /> },
          { path: paths.orders.path, element: <OrdersRoute /> },
          { path: paths.newOrder.path, element: <OrderEditorRoute /> },
          { path: paths.order.path, element: <OrderRoute /> },
          { path: paths.editOrder.path, element: <OrderEditorRoute /> },
          { path: paths.receiveOrder.path, element: <OrderReceiveRoute /> },
          { path: '*', element: <NotFoundRoute /> },
        ],
      },
    ],
  },
]);
