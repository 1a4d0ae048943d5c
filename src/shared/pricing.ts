import { readDecimal, rules } from './checks';
import { dec, type Dec, type DecimalInput } from './decimal';
import { FieldErrors } from './errors';
import {
  currencyMinorUnits,
  isCurrencyCode,
  minorUnitStep,
  roundHalfUp,
  roundToStep,
  writeMoney,
  writePercent,
  type RoundingMode,
} from './money';

export type TaxMode = 'inclusive' | 'exclusive';
export const TAX_MODES = ['inclusive', 'exclusive'] as const satisfies readonly TaxMode[];
export const ROUNDING_MODES = ['up', 'nearest', 'none'] as const satisfies readonly RoundingMode[];

/** How a business prices: all numbers are decimal strings, as the API and the database carry them. */
export interface PricingPolicy {
  /** Target gross margin on the net (tax-free) price, in [0, 100). */
  targetMarginPct: string;
  /** `inclusive`: menu prices include tax (UK VAT); `exclusive`: tax is added at the till (US sales tax). */
  taxMode: TaxMode;
  /** Tax rate in %, 0 or more. */
  taxRatePct: string;
  /** Price step for `up` and `nearest`, e.g. "0.05"; a whole number of the currency's minor unit. */
  priceStep?: string | null;
  rounding: RoundingMode;
}

const HUNDRED = dec('100');

/** A policy read into decimals once. */
export interface ParsedPolicy {
  readonly margin: Dec;
  readonly inclusive: boolean;
  readonly taxRate: Dec;
  readonly step: Dec | null;
  readonly rounding: RoundingMode;
  readonly currency: string;
  /** 100 + tax rate when tax is inclusive, else 100: gross per 100 of net, worked out once. */
  readonly grossPer100: Dec;
  /** 100 − target margin: the net share left for cost, worked out once. */
  readonly costShare: Dec;
}

/**
 * Reads and checks a policy and currency, recording problems under `currency` and
 * `policy.<field>`; null when any field is refused.
 */
export function readPolicy(policy: PricingPolicy, currency: string, errors: FieldErrors, path = 'policy'): ParsedPolicy | null {
  const before = Object.keys(errors.fields).length;
  const currencyOk = isCurrencyCode(currency);
  if (!currencyOk) errors.add('currency', 'Enter a three-letter ISO 4217 currency code such as GBP.');
  const margin = readDecimal(policy?.targetMarginPct, rules.marginPct, `${path}.targetMarginPct`, errors);
  const taxRate = readDecimal(policy?.taxRatePct, rules.nonNegative, `${path}.taxRatePct`, errors);
  const taxMode = policy?.taxMode;
  if (!(TAX_MODES as readonly string[]).includes(taxMode)) errors.add(`${path}.taxMode`, 'Choose whether prices include tax (inclusive) or not (exclusive).');
  const rounding = policy?.rounding;
  if (!(ROUNDING_MODES as readonly string[]).includes(rounding)) errors.add(`${path}.rounding`, 'Choose rounding up, to the nearest step, or none.');
  let step: Dec | null = null;
  if (rounding === 'up' || rounding === 'nearest') {
    if (policy.priceStep === undefined || policy.priceStep === null || policy.priceStep === '') {
      errors.add(`${path}.priceStep`, 'Enter a price step (such as 0.05) to round up or to the nearest step.');
    } else step = readDecimal(policy.priceStep, rules.positive, `${path}.priceStep`, errors);
    if (step && currencyOk) {
      const minor = minorUnitStep(currency);
      if (!step.mod(minor).isZero()) {
        errors.add(`${path}.priceStep`, `A price step must be a whole number of ${currency}'s smallest unit (${minor.toFixed()}).`);
      }
    }
  }
  if (Object.keys(errors.fields).length > before || !margin || !taxRate) return null;
  const inclusive = taxMode === 'inclusive';
  return { margin, inclusive, taxRate, step, rounding, currency, grossPer100: inclusive ? taxRate.plus(HUNDRED) : HUNDRED, costShare: HUNDRED.minus(margin) };
}

const parsedCache = new WeakMap<PricingPolicy, Map<string, ParsedPolicy>>();

/** {@link readPolicy} that throws a CostingInputError, memoised per policy object and currency. */
export function parsePolicy(policy: PricingPolicy, currency: string): ParsedPolicy {
  const byCurrency = parsedCache.get(policy);
  const hit = byCurrency?.get(currency);
  if (hit) return hit;
  const errors = new FieldErrors();
  const parsed = readPolicy(policy, currency, errors);
  errors.throwIfAny();
  const map = byCurrency ?? new Map<string, ParsedPolicy>();
  map.set(currency, parsed as ParsedPolicy);
  parsedCache.set(policy, map);
  return parsed as ParsedPolicy;
}


/**
 * The unrounded price that gives exactly the target margin on `cost`.
 *
 * net = cost ÷ (1 − margin ÷ 100); gross = net × (1 + tax ÷ 100) when tax is inclusive, = net
 * when exclusive. Computed as cost × (100 + tax) ÷ (100 − margin) (or cost × 100 ÷ (100 − margin))
 * so there is only one division. Margin on net price: Dittmer & Keefe ch. 8 (cost % = cost ÷ net
 * sales); price = cost ÷ cost % (Goodheart-Willcox, Controlling Costs in Foodservice, ch. 2).
 */
export function grossForTargetMargin(cost: DecimalInput, policy: PricingPolicy | ParsedPolicy, currency?: string): Dec {
  const p = asParsed(policy, currency);
  return dec(cost).times(p.grossPer100).div(p.costShare);
}

/**
 * Rounds a gross price by the policy: `up` → the smallest multiple of the step not below it;
 * `nearest` → the nearest multiple, halves up; `none` → the currency's minor unit, halves up.
 */
export function roundPrice(gross: DecimalInput, policy: PricingPolicy | ParsedPolicy, currency?: string): Dec {
  const p = asParsed(policy, currency);
  if (p.rounding === 'none' || !p.step) return roundHalfUp(gross, currencyMinorUnits(p.currency));
  return roundToStep(gross, p.step, p.rounding);
}

/**
 * Suggested menu price for a cup costing `cost`: {@link grossForTargetMargin} rounded by the
 * policy ({@link roundPrice}), written to the currency's minor units. With `up` the margin at
 * this price is never below the target.
 */
export function suggestPrice(cost: DecimalInput, policy: PricingPolicy | ParsedPolicy, currency: string): string {
  const p = asParsed(policy, currency);
  return writeMoney(roundPrice(grossForTargetMargin(cost, p), p), currency);
}

/**
 * Upcharge for a modifier (an extra shot, a plant drink) that keeps the target margin on its
 * extra cost: delta ÷ (1 − margin ÷ 100), × (1 + tax ÷ 100) when tax is inclusive, rounded by
 * the policy. A negative delta (a cheaper swap) gives a negative or zero figure: whether to offer
 * a discount is the caller's decision.
 */
export function suggestUpcharge(modifierCostDelta: DecimalInput, policy: PricingPolicy, currency: string): string {
  const p = parsePolicy(policy, currency);
  return writeMoney(roundPrice(grossForTargetMargin(modifierCostDelta, p), p), currency);
}

export interface ExactPriceFigures {
  price: Dec;
  netPrice: Dec;
  tax: Dec;
  /** null when the net price is 0 (a margin of a zero price is undefined). */
  marginPct: Dec | null;
  costPct: Dec | null;
  profit: Dec;
}

/** The figures of one price as written in an API response. */
export interface PriceFigures {
  price: string;
  netPrice: string;
  /** Tax within the price; 0 when prices exclude tax (it is added at the till). */
  tax: string;
  marginPct: string | null;
  costPct: string | null;
  profit: string;
}

/**
 * Unrounded figures of a menu price for a cup costing `cost`.
 *
 * net = price ÷ (1 + tax ÷ 100) when inclusive (= price × 100 ÷ (100 + tax): the UK VAT
 * fraction, 1/6 of the price at 20 %, HMRC), else the price; tax = price − net;
 * margin % = (net − cost) ÷ net × 100; cost % = cost ÷ net × 100 (Dittmer & Keefe ch. 8);
 * profit = net − cost.
 */
export function exactPriceFigures(price: DecimalInput, cost: DecimalInput, policy: PricingPolicy | ParsedPolicy, currency?: string): ExactPriceFigures {
  const p = asParsed(policy, currency);
  const gross = dec(price);
  const c = dec(cost);
  const net = p.inclusive ? netOf(gross, price, p) : gross;
  const costPct = net.isZero() ? null : costPctOf(c, net);
  return {
    price: gross,
    netPrice: net,
    tax: gross.minus(net),
    marginPct: costPct ? HUNDRED.minus(costPct) : null,
    costPct,
    profit: net.minus(c),
  };
}

/** cost ÷ net × 100; (net − cost) ÷ net × 100 = 100 − this exactly, so one division gives both. */
function costPctOf(cost: Dec, net: Dec): Dec {
  return cost.times(HUNDRED).div(net);
}

/**
 * The margin % alone of {@link exactPriceFigures} (same steps, same value), for callers that
 * need nothing else of a price, such as a whole menu's below-target marks.
 */
export function exactMarginPct(price: DecimalInput, cost: DecimalInput, policy: PricingPolicy | ParsedPolicy, currency?: string): Dec | null {
  const p = asParsed(policy, currency);
  const gross = dec(price);
  const net = p.inclusive ? netOf(gross, price, p) : gross;
  return net.isZero() ? null : HUNDRED.minus(costPctOf(dec(cost), net));
}

const netMemo = new WeakMap<ParsedPolicy, Map<string, Dec>>();
const NET_MEMO_LIMIT = 5_000;

/**
 * Net of a tax-inclusive price: price × 100 ÷ (100 + tax). Memoised per policy for prices given
 * as strings: a menu has a few dozen distinct prices over hundreds of cup sizes, and the
 * division is the dearest step of a price's figures.
 */
function netOf(gross: Dec, price: DecimalInput, p: ParsedPolicy): Dec {
  if (typeof price !== 'string') return gross.times(HUNDRED).div(p.grossPer100);
  let memo = netMemo.get(p);
  if (!memo) netMemo.set(p, (memo = new Map()));
  let net = memo.get(price);
  if (net === undefined) {
    if (memo.size >= NET_MEMO_LIMIT) memo.clear();
    net = gross.times(HUNDRED).div(p.grossPer100);
    memo.set(price, net);
  }
  return net;
}

/** Writes {@link ExactPriceFigures}: money to the currency's minor units, percentages to 2 places, halves up. */
export function writePriceFigures(f: ExactPriceFigures, currency: string): PriceFigures {
  return {
    price: writeMoney(f.price, currency),
    netPrice: writeMoney(f.netPrice, currency),
    tax: writeMoney(f.tax, currency),
    marginPct: f.marginPct ? writePercent(f.marginPct) : null,
    costPct: f.costPct ? writePercent(f.costPct) : null,
    profit: writeMoney(f.profit, currency),
  };
}

/**
 * The figures of a menu price (net, tax, margin %, cost %, profit), each computed from the
 * unrounded values and then written out (see {@link exactPriceFigures}).
 */
export function priceFigures(price: DecimalInput, cost: DecimalInput, policy: PricingPolicy, currency: string): PriceFigures {
  return writePriceFigures(exactPriceFigures(price, cost, parsePolicy(policy, currency)), currency);
}

/**
 * Sales tax added at the till on a tax-exclusive price: price × rate ÷ 100, to the currency's
 * minor unit, halves up. Massachusetts DOR (meals tax, M.G.L. c.64H §4) rounds the same way:
 * $4.56 at 6.25 % = $0.285 → $0.29. Other places round differently: check local rules.
 */
export function taxOnTop(price: DecimalInput, taxRatePct: DecimalInput, currency: string): string {
  return writeMoney(dec(price).times(dec(taxRatePct)).div(HUNDRED), currency);
}

function asParsed(policy: PricingPolicy | ParsedPolicy, currency?: string): ParsedPolicy {
  if ('margin' in policy) return policy;
  if (currency === undefined) throw new TypeError('A currency is needed with an unparsed policy.');
  return parsePolicy(policy, currency);
}
