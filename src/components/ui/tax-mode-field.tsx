import { useId } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';
import { focusRing } from './cx';

/** The usual caution beside any tax setting: the rules are local and this product is not tax advice. */
export function TaxCaution() {
  return (
    <p className="rounded-md border border-butter bg-butter/20 px-3 py-2 text-sm text-ink">
      <span className="font-medium">Check with your tax authority.</span> Whether menu prices must include sales tax or VAT, and at what
      rates, depends on where you trade and can differ by item and by eat-in or take-away. Confirm the rules with your tax authority or an
      accountant; this setting only changes how prices are shown and worked out.
    </p>
  );
}

/** Whether menu prices include tax: a radio pair with the tax caution under it. */
export function TaxModeField({ field, error }: { field: UseFormRegisterReturn; error?: string }) {
  const errorId = `${useId()}-error`;
  return (
    <fieldset className="flex flex-col gap-2" aria-describedby={error ? errorId : undefined}>
      <legend className="mb-1 text-sm font-medium text-ink">Menu prices</legend>
      <label className="flex items-start gap-2 text-ink">
        <input type="radio" value="inclusive" className={`mt-1 h-4 w-4 shrink-0 accent-copper ${focusRing}`} aria-invalid={error ? true : undefined} {...field} />
        <span>
          <span className="font-medium">Include tax</span>: the price on the menu is what the customer pays.
        </span>
      </label>
      <label className="flex items-start gap-2 text-ink">
        <input type="radio" value="exclusive" className={`mt-1 h-4 w-4 shrink-0 accent-copper ${focusRing}`} aria-invalid={error ? true : undefined} {...field} />
        <span>
          <span className="font-medium">Exclude tax</span>: tax is added on top at the till.
        </span>
      </label>
      {error && (
        <p id={errorId} className="text-sm font-medium text-rose">
          {error}
        </p>
      )}
      <TaxCaution />
    </fieldset>
  );
}
