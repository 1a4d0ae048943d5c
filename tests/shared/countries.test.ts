import { describe, expect, test } from 'vitest';
import { COUNTRY_DEFAULTS, countryDefaults } from '../../src/shared/countries';

// Standard rates as the tax authorities publish them: tests/SOURCES.md, "Standard tax rates by
// country" (secondary: check the authority's current rate before relying on it).
describe('what the country sets at sign-up', () => {
  test.each([
    ['GB', 'GBP', 'VAT', 'inclusive', '20'], // HMRC
    ['IE', 'EUR', 'VAT', 'inclusive', '23'], // Revenue
    ['DE', 'EUR', 'VAT (USt)', 'inclusive', '19'], // BMF
    ['FR', 'EUR', 'VAT (TVA)', 'inclusive', '20'], // impots.gouv
    ['NL', 'EUR', 'VAT (btw)', 'inclusive', '21'], // Belastingdienst
    ['ES', 'EUR', 'VAT (IVA)', 'inclusive', '21'], // AEAT
    ['IT', 'EUR', 'VAT (IVA)', 'inclusive', '22'], // Agenzia delle Entrate
    ['AU', 'AUD', 'GST', 'inclusive', '10'], // ATO
    ['NZ', 'NZD', 'GST', 'inclusive', '15'], // IRD
  ])('%s: %s, %s %s at %s %%', (code, currency, taxName, taxMode, rate) => {
    expect(countryDefaults(code)).toMatchObject({ currency, taxName, taxMode, standardRatePct: rate });
    expect(countryDefaults(code)?.source).toBeTruthy();
  });

  test('the United States and Canada add sales tax at the till, at a rate the owner sets (it depends on the locality)', () => {
    for (const code of ['US', 'CA']) expect(countryDefaults(code)).toMatchObject({ taxMode: 'exclusive', standardRatePct: null });
    expect(countryDefaults('US')?.currency).toBe('USD');
    expect(countryDefaults('CA')?.currency).toBe('CAD');
  });

  test('a country we hold nothing for leaves every field to the owner; each currency is one the runtime knows', () => {
    expect(countryDefaults('JP')).toBeNull();
    const known = new Set(Intl.supportedValuesOf('currency'));
    for (const c of COUNTRY_DEFAULTS) expect(known.has(c.currency)).toBe(true);
  });
});
