/**
 * A small exact rational (BigInt numerator / denominator) used as an independent reference
 * for the decimal.js costing core. Test-only.
 */
export class Q {
  readonly n: bigint;
  readonly d: bigint;
  constructor(n: bigint, d: bigint = 1n) {
    if (d === 0n) throw new RangeError('zero denominator');
    if (d < 0n) {
      n = -n;
      d = -d;
    }
    const g = gcd(n < 0n ? -n : n, d);
    this.n = n / g;
    this.d = d / g;
  }

  static of(value: string | number | bigint | Q): Q {
    if (value instanceof Q) return value;
    if (typeof value === 'bigint') return new Q(value);
    const s = String(value);
    const m = /^(-?)(\d+)(?:\.(\d+))?$/.exec(s);
    if (!m) throw new Error(`not a decimal: ${s}`);
    const frac = m[3] ?? '';
    const n = BigInt(m[2] + frac) * (m[1] ? -1n : 1n);
    return new Q(n, 10n ** BigInt(frac.length));
  }

  plus(o: Q | string): Q {
    const b = Q.of(o);
    return new Q(this.n * b.d + b.n * this.d, this.d * b.d);
  }
  minus(o: Q | string): Q {
    const b = Q.of(o);
    return new Q(this.n * b.d - b.n * this.d, this.d * b.d);
  }
  times(o: Q | string): Q {
    const b = Q.of(o);
    return new Q(this.n * b.n, this.d * b.d);
  }
  div(o: Q | string): Q {
    const b = Q.of(o);
    return new Q(this.n * b.d, this.d * b.n);
  }
  cmp(o: Q | string): number {
    const b = Q.of(o);
    const l = this.n * b.d;
    const r = b.n * this.d;
    return l < r ? -1 : l > r ? 1 : 0;
  }
  isZero(): boolean {
    return this.n === 0n;
  }

  /** Rounded to `places` decimals, halves away from zero, written with exactly that many decimals. */
  toFixedHalfUp(places: number): string {
    const scale = 10n ** BigInt(places);
    const neg = this.n < 0n;
    const a = neg ? -this.n : this.n;
    const q = (2n * a * scale + this.d) / (2n * this.d);
    return format(neg && q !== 0n ? -q : q, places);
  }

  /** Smallest integer not below this value. */
  ceil(): bigint {
    const f = this.n / this.d; // truncates toward zero
    return this.n > 0n && f * this.d !== this.n ? f + 1n : f;
  }

  /** Nearest integer, halves away from zero. */
  roundHalfUp(): bigint {
    const neg = this.n < 0n;
    const a = neg ? -this.n : this.n;
    const q = (2n * a + this.d) / (2n * this.d);
    return neg ? -q : q;
  }

  /** Exact decimal expansion without trailing zeros, when it terminates within `max` places. */
  toExactDecimal(max = 60): string | null {
    for (let k = 0; k <= max; k++) {
      const scale = 10n ** BigInt(k);
      if ((this.n * scale) % this.d === 0n) {
        return format((this.n * scale) / this.d, k);
      }
    }
    return null;
  }
}

function gcd(a: bigint, b: bigint): bigint {
  while (b) [a, b] = [b, a % b];
  return a === 0n ? 1n : a;
}

function format(scaled: bigint, places: number): string {
  const neg = scaled < 0n;
  let digits = (neg ? -scaled : scaled).toString();
  if (places > 0) {
    digits = digits.padStart(places + 1, '0');
    digits = `${digits.slice(0, -places)}.${digits.slice(-places)}`;
  }
  return neg ? `-${digits}` : digits;
}

/**
 * Unit factors derived here from their definitions, independently of src/shared/units.ts:
 * NIST Handbook 44 Appendix C — inch = 2.54 cm exactly; US gallon = 231 in³; US fl oz = 1/128
 * gallon; cup = 8 fl oz; pint = 16 fl oz; quart = 32 fl oz; tablespoon = 1/2 fl oz; teaspoon =
 * 1/3 tablespoon; pound = 0.45359237 kg; ounce = 1/16 pound. UK Weights and Measures Act 1985
 * Schedule 1 — gallon = 4.54609 l; pint = 1/8 gallon; fluid ounce = 1/20 pint.
 */
export function referenceFactors(): Record<string, Q> {
  const cubicInchMl = Q.of('2.54').times('2.54').times('2.54');
  const galUs = cubicInchMl.times('231');
  const flOzUs = galUs.div('128');
  const lb = Q.of('453.59237');
  const galImp = Q.of('4546.09');
  const ptImp = galImp.div('8');
  return {
    g: Q.of(1),
    kg: Q.of(1000),
    oz: lb.div('16'),
    lb,
    ml: Q.of(1),
    l: Q.of(1000),
    tbsp: flOzUs.div('2'),
    tsp: flOzUs.div('2').div('3'),
    fl_oz_us: flOzUs,
    fl_oz_imp: ptImp.div('20'),
    cup_us: flOzUs.times('8'),
    pt_us: flOzUs.times('16'),
    pt_imp: ptImp,
    qt_us: flOzUs.times('32'),
    gal_us: galUs,
    gal_imp: galImp,
    each: Q.of(1),
  };
}
