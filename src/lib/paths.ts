/**
 * Every URL the client builds, in one place. `path` is the router pattern,
 * `href(...)` builds a link to it. `api` holds the server endpoints.
 */

function withQuery(base: string, query: Record<string, string | undefined>): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) if (value) params.set(key, value);
  const qs = params.toString();
  return qs ? `${base}?${qs}` : base;
}

export const paths = {
  home: { path: '/', href: () => '/' },
  signIn: { path: '/sign-in', href: (next?: string) => withQuery('/sign-in', { next }) },
  signUp: { path: '/sign-up', href: () => '/sign-up' },
  forgotPassword: { path: '/forgot-password', href: () => '/forgot-password' },
  resetPassword: { path: '/reset-password', href: (token?: string) => withQuery('/reset-password', { token }) },
  acceptInvite: { path: '/accept-invite', href: (token?: string) => withQuery('/accept-invite', { token }) },
  gettingStarted: { path: '/getting-started', href: () => '/getting-started' },
  team: { path: '/team', href: () => '/team' },
  settings: { path: '/settings', href: () => '/settings' },
  // Pages other engineers are building; until they land these show the 404 page.
  cupSizes: { path: '/pricing', href: () => '/pricing#cup-sizes' },
  suppliers: { path: '/suppliers', href: () => '/suppliers' },
  drinks: { path: '/drinks', href: () => '/drinks' },
  // Costing pages.
  newDrink: { path: '/drinks/new', href: () => '/drinks/new' },
  drink: { path: '/drinks/:drinkId', href: (id: string) => `/drinks/${encodeURIComponent(id)}` },
  ingredients: { path: '/ingredients', href: () => '/ingredients' },
  newIngredient: { path: '/ingredients/new', href: () => '/ingredients/new' },
  ingredient: { path: '/ingredients/:ingredientId', href: (id: string) => `/ingredients/${encodeURIComponent(id)}` },
  preparations: { path: '/preparations', href: () => '/preparations' },
  newPreparation: { path: '/preparations/new', href: () => '/preparations/new' },
  preparation: { path: '/preparations/:preparationId', href: (id: string) => `/preparations/${encodeURIComponent(id)}` },
  menuCosting: { path: '/menu-costing', href: () => '/menu-costing' },
  pricing: { path: '/pricing', href: () => '/pricing' },
  cards: { path: '/cards', href: () => '/cards' },
  card: { path: '/cards/:drinkId', href: (id: string) => `/cards/${encodeURIComponent(id)}` },
  modifiers: { path: '/modifiers', href: () => '/modifiers' },
  newModifier: { path: '/modifiers/new', href: () => '/modifiers/new' },
  modifier: { path: '/modifiers/:modifierId', href: (id: string) => `/modifiers/${encodeURIComponent(id)}` },

  // Repricing.
  repricing: { path: '/repricing', href: () => '/repricing' },
  priceList: { path: '/price-list', href: () => '/price-list' },
  priceHistory: { path: '/drinks/:drinkId/price-history', href: (id: string) => `/drinks/${encodeURIComponent(id)}/price-history` },

  // Books: counts, waste, till sales and month end.
  monthEnd: { path: '/month-end', href: (month?: string) => withQuery('/month-end', { month }) },
  stockCounts: { path: '/stock-counts', href: () => '/stock-counts' },
  stockCount: { path: '/stock-counts/:countId', href: (id: string) => `/stock-counts/${encodeURIComponent(id)}` },
  waste: { path: '/waste', href: () => '/waste' },
  tillSales: { path: '/till-sales', href: () => '/till-sales' },

  // Suppliers, stock and purchase orders.
  newSupplier: { path: '/suppliers/new', href: () => '/suppliers/new' },
  supplier: { path: '/suppliers/:supplierId', href: (id: string) => `/suppliers/${encodeURIComponent(id)}` },
  stock: { path: '/stock', href: (supplierId?: string) => withQuery('/stock', { supplierId }) },
  orders: { path: '/orders', href: () => '/orders' },
  newOrder: { path: '/orders/new', href: (q: { siteId?: string; supplierId?: string; suggested?: boolean } = {}) => withQuery('/orders/new', { siteId: q.siteId, supplierId: q.supplierId, suggested: q.suggested ? '1' : undefined }) },
  order: { path: '/orders/:orderId', href: (id: string) => `/orders/${encodeURIComponent(id)}` },
  editOrder: { path: '/orders/:orderId/edit', href: (id: string) => `/orders/${encodeURIComponent(id)}/edit` },
  receiveOrder: { path: '/orders/:orderId/receive', href: (id: string) => `/orders/${encodeURIComponent(id)}/receive` },

  api: {
    cogs: (month: string, siteId: string | null) => withQuery('/api/reports/cogs', { month, siteId: siteId ?? undefined }),
    cogsCsv: (month: string, siteId: string | null) => withQuery('/api/reports/cogs.csv', { month, siteId: siteId ?? undefined }),
    purchasesCsv: (month: string, siteId: string | null) => withQuery('/api/reports/purchases.csv', { month, siteId: siteId ?? undefined }),
    stockValuationCsv: (countId: string) => withQuery('/api/reports/stock-valuation.csv', { countId }),
    cogsTrend: (month: string, siteId: string | null) => withQuery('/api/reports/cogs-trend', { month, siteId: siteId ?? undefined, months: '6' }),
    purchasesBySupplier: (month: string, siteId: string | null) => withQuery('/api/reports/purchases-by-supplier', { month, siteId: siteId ?? undefined }),
    periods: () => '/api/periods',
    closePeriod: (month: string) => `/api/periods/${encodeURIComponent(month)}/close`,
    reopenPeriod: (month: string) => `/api/periods/${encodeURIComponent(month)}/reopen`,
    stockCounts: (siteId?: string) => withQuery('/api/stock-counts', { siteId }),
    stockCount: (id: string) => `/api/stock-counts/${encodeURIComponent(id)}`,
    countLine: (id: string, packId: string) => `/api/stock-counts/${encodeURIComponent(id)}/lines/${encodeURIComponent(packId)}`,
    finishCount: (id: string) => `/api/stock-counts/${encodeURIComponent(id)}/finish`,
    waste: (query: { siteId?: string; month?: string } = {}) => withQuery('/api/waste', query),
    wasteChoices: () => '/api/waste/choices',
    wasteEntry: (id: string) => `/api/waste/${encodeURIComponent(id)}`,
    salesImports: (siteId?: string) => withQuery('/api/sales-imports', { siteId }),
    salesImport: (id: string) => `/api/sales-imports/${encodeURIComponent(id)}`,
    importPreview: (id: string) => `/api/sales-imports/${encodeURIComponent(id)}/preview`,
    importAccept: (id: string) => `/api/sales-imports/${encodeURIComponent(id)}/accept`,
    salesDays: (query: { siteId?: string; month?: string } = {}) => withQuery('/api/sales/days', query),
    salesDay: (siteId: string, soldOn: string) => withQuery(`/api/sales/days/${encodeURIComponent(soldOn)}`, { siteId }),
    me: () => '/api/auth/me',
    login: () => '/api/auth/login',
    logout: () => '/api/auth/logout',
    signup: () => '/api/auth/signup',
    resetRequest: () => '/api/auth/password-reset/request',
    resetComplete: () => '/api/auth/password-reset/complete',
    invitation: (token: string) => `/api/invitations/${encodeURIComponent(token)}`,
    acceptInvitation: (token: string) => `/api/invitations/${encodeURIComponent(token)}/accept`,
    team: () => '/api/team',
    teamInvitations: () => '/api/team/invitations',
    teamInvitation: (id: string) => `/api/team/invitations/${encodeURIComponent(id)}`,
    teamMember: (id: string) => `/api/team/members/${encodeURIComponent(id)}`,
    sites: () => '/api/sites',
    site: (id: string) => `/api/sites/${encodeURIComponent(id)}`,
    business: () => '/api/business',
    config: () => '/api/config',
    // Costing.
    costingPreview: () => '/api/costing/preview',
    sizes: () => '/api/sizes',
    size: (id: string) => `/api/sizes/${encodeURIComponent(id)}`,
    suppliers: () => '/api/suppliers',
    ingredients: () => '/api/ingredients',
    ingredient: (id: string) => `/api/ingredients/${encodeURIComponent(id)}`,
    ingredientPacks: (id: string) => `/api/ingredients/${encodeURIComponent(id)}/packs`,
    ingredientMeasures: (id: string) => `/api/ingredients/${encodeURIComponent(id)}/measures`,
    pack: (id: string) => `/api/packs/${encodeURIComponent(id)}`,
    packPrices: (id: string) => `/api/packs/${encodeURIComponent(id)}/prices`,
    measure: (id: string) => `/api/measures/${encodeURIComponent(id)}`,
    preparations: () => '/api/preparations',
    preparation: (id: string) => `/api/preparations/${encodeURIComponent(id)}`,
    preparationMeasures: (id: string) => `/api/preparations/${encodeURIComponent(id)}/measures`,
    drinks: () => '/api/drinks',
    drink: (id: string) => `/api/drinks/${encodeURIComponent(id)}`,
    drinkCosting: (id: string) => `/api/drinks/${encodeURIComponent(id)}/costing`,
    drinkCard: (id: string) => `/api/drinks/${encodeURIComponent(id)}/card`,
    cards: () => '/api/cards',
    menuCosting: () => '/api/menu/costing',
    pricingPolicy: () => '/api/pricing-policy',
    modifiers: () => '/api/modifiers',
    modifier: (id: string) => `/api/modifiers/${encodeURIComponent(id)}`,
    // Repricing.
    repricePreview: () => '/api/reprice/preview',
    repriceApply: () => '/api/reprice/apply',
    repricePlanned: () => '/api/reprice/planned',
    repriceScenarios: () => '/api/reprice/scenarios',
    repriceScenario: (id: string) => `/api/reprice/scenarios/${encodeURIComponent(id)}`,
    repriceCompare: (ids: readonly string[]) => `/api/reprice/compare?ids=${ids.map(encodeURIComponent).join(',')}`,
    drinkPriceHistory: (id: string) => `/api/drinks/${encodeURIComponent(id)}/price-history`,
    priceList: (date?: string) => (date ? `/api/price-list?date=${encodeURIComponent(date)}` : '/api/price-list'),
    priceListCsv: (date?: string) => (date ? `/api/price-list.csv?date=${encodeURIComponent(date)}` : '/api/price-list.csv'),
    repriceScheduled: () => '/api/reprice/scheduled',
    repriceCancelScheduled: (id: string) => `/api/reprice/scheduled/${encodeURIComponent(id)}/cancel`,
    // Suppliers, stock and purchase orders.
    supplier: (id: string) => `/api/suppliers/${encodeURIComponent(id)}`,
    supplierOrdering: (id: string) => `/api/suppliers/${encodeURIComponent(id)}/ordering`,
    supplierCatalogue: (id: string) => `/api/suppliers/${encodeURIComponent(id)}/catalogue`,
    siteStock: (siteId: string) => `/api/sites/${encodeURIComponent(siteId)}/stock`,
    siteStockItem: (siteId: string, packId: string) => `/api/sites/${encodeURIComponent(siteId)}/stock/${encodeURIComponent(packId)}`,
    siteStockItemArea: (siteId: string, packId: string) => `/api/sites/${encodeURIComponent(siteId)}/stock/${encodeURIComponent(packId)}/storage-area`,
    storageAreas: (siteId: string) => `/api/sites/${encodeURIComponent(siteId)}/storage-areas`,
    storageArea: (siteId: string, areaId: string) => `/api/sites/${encodeURIComponent(siteId)}/storage-areas/${encodeURIComponent(areaId)}`,
    storageAreaOrder: (siteId: string) => `/api/sites/${encodeURIComponent(siteId)}/storage-areas/order`,
    suggestedOrder: (siteId: string, supplierId: string) => `/api/sites/${encodeURIComponent(siteId)}/suggested-order?supplierId=${encodeURIComponent(supplierId)}`,
    purchaseOrders: (q: { siteId?: string; supplierId?: string; status?: string } = {}) => withQuery('/api/purchase-orders', q),
    purchaseOrder: (id: string) => `/api/purchase-orders/${encodeURIComponent(id)}`,
    purchaseOrderAction: (id: string, action: 'place' | 'pay' | 'payment/check' | 'receive' | 'close' | 'cancel' | 'pack-prices' | 'invoice') =>
      `/api/purchase-orders/${encodeURIComponent(id)}/${action}`,
    paymentCard: () => '/api/payments/card',
  },
} as const;

/** Only same-site paths may be used as a post-sign-in destination. */
export function safeNext(next: string | null | undefined): string {
  if (next && next.startsWith('/') && !next.startsWith('//') && !next.startsWith('/\\')) return next;
  return paths.home.href();
}
