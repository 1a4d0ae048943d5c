/**
 * What a country sets when a business is opened there: its currency, the tax's own name,
 * whether menu prices include it and its standard rate. The owner sees each and may change it
 * on the same screen. Rates change and reduced rates apply to some food and drink (eat-in or
 * takeaway, hot or cold): the product says so and defers to the tax authority and an
 * accountant. Sources are the tax authorities' own rate pages, as listed in tests/SOURCES.md
 * ("Standard tax rates by country", secondary: check the authority's current rate).
 */
export interface CountryDefaults {
  code: string;
  currency: string;
  /** The tax as people there call it on a receipt. */
  taxName: string;
  /** Whether menu prices are shown with the tax in (VAT, GST) or it is added at the till (sales tax). */
  taxMode: 'inclusive' | 'exclusive';
  /** The standard rate in %, or null where it depends on the locality and the owner sets it. */
  standardRatePct: string | null;
  /** Where the rate comes from. */
  source: string;
}

export const COUNTRY_DEFAULTS: readonly CountryDefaults[] = [
  { code: 'GB', currency: 'GBP', taxName: 'VAT', taxMode: 'inclusive', standardRatePct: '20', source: 'HMRC, VAT rates' },
  { code: 'IE', currency: 'EUR', taxName: 'VAT', taxMode: 'inclusive', standardRatePct: '23', source: 'Revenue (Irish Tax and Customs), VAT rates' },
  { code: 'DE', currency: 'EUR', taxName: 'VAT (USt)', taxMode: 'inclusive', standardRatePct: '19', source: 'Federal Ministry of Finance (BMF)' },
  { code: 'FR', currency: 'EUR', taxName: 'VAT (TVA)', taxMode: 'inclusive', standardRatePct: '20', source: 'impots.gouv.fr' },
  { code: 'NL', currency: 'EUR', taxName: 'VAT (btw)', taxMode: 'inclusive', standardRatePct: '21', source: 'Belastingdienst' },
  { code: 'ES', currency: 'EUR', taxName: 'VAT (IVA)', taxMode: 'inclusive', standardRatePct: '21', source: 'Agencia Tributaria (AEAT)' },
  { code: 'IT', currency: 'EUR', taxName: 'VAT (IVA)', taxMode: 'inclusive', standardRatePct: '22', source: 'Agenzia delle Entrate' },
  { code: 'AU', currency: 'AUD', taxName: 'GST', taxMode: 'inclusive', standardRatePct: '10', source: 'Australian Taxation Office (ATO)' },
  { code: 'NZ', currency: 'NZD', taxName: 'GST', taxMode: 'inclusive', standardRatePct: '15', source: 'Inland Revenue (IRD)' },
  { code: 'US', currency: 'USD', taxName: 'Sales tax', taxMode: 'exclusive', standardRatePct: null, source: 'set by the state, county and city where you trade' },
  { code: 'CA', currency: 'CAD', taxName: 'Sales tax (GST/HST/PST)', taxMode: 'exclusive', standardRatePct: null, source: 'set by the province where you trade' },
];

/** The defaults of a country, or null for a country we hold none for (the owner fills each in). */
export function countryDefaults(code: string): CountryDefaults | null {
  return COUNTRY_DEFAULTS.find((c) => c.code === code.toUpperCase()) ?? null;
}

export const TAX_CAUTION =
  'Tax rates, and which sales are taxed at which rate (eat-in or takeaway, hot or cold, food or drink), depend on where you trade and change from time to time. ' +
  'Check your rates with your tax authority or an accountant; Tamp & Tally only applies the figures you enter.';
