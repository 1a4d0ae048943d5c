import { useMemo } from 'react';
import { countryChoices, currencyChoices, type Choice } from '../../lib/regions';

function Options({ placeholder, choices }: { placeholder: string; choices: Choice[] }) {
  return (
    <>
      <option value="">{placeholder}</option>
      {choices.map((c) => (
        <option key={c.value} value={c.value}>
          {c.label}
        </option>
      ))}
    </>
  );
}

/** <option>s for a country select, names in the reader's language. */
export function CountryOptions({ placeholder = 'Choose a country' }: { placeholder?: string }) {
  const choices = useMemo(() => countryChoices(), []);
  return <Options placeholder={placeholder} choices={choices} />;
}

/** <option>s for a currency select. */
export function CurrencyOptions({ placeholder = 'Choose a currency' }: { placeholder?: string }) {
  const choices = useMemo(() => currencyChoices(), []);
  return <Options placeholder={placeholder} choices={choices} />;
}
