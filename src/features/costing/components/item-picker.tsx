import { useId, useState } from 'react';
import { Input } from '../../../components/ui/input';

export interface ItemChoice {
  /** "i:<ingredient id>" or "p:<preparation id>". */
  key: string;
  label: string;
}

/**
 * A searchable choice of ingredient or preparation: type to narrow the list,
 * pick a name. The field's value is the item's key; typed text that names no
 * item leaves it empty, and the form says so.
 */
export function ItemPicker({ id, value, choices, onChange, onBlur, invalid, describedBy, label }: {
  id: string;
  value: string;
  choices: readonly ItemChoice[];
  onChange: (key: string) => void;
  onBlur?: () => void;
  invalid?: boolean;
  describedBy?: string;
  label: string;
}) {
  const listId = useId();
  const [text, setText] = useState(() => choices.find((c) => c.key === value)?.label ?? '');
  return (
    <>
      <Input
        id={id}
        list={listId}
        value={text}
        autoComplete="off"
        placeholder="Type to search"
        aria-label={label}
        aria-describedby={describedBy}
        invalid={invalid}
        onBlur={onBlur}
        onChange={(e) => {
          const t = e.target.value;
          setText(t);
          const match = choices.find((c) => c.label.toLowerCase() === t.trim().toLowerCase());
          onChange(match?.key ?? '');
        }}
      />
      <datalist id={listId}>
        {choices.map((c) => (
          <option key={c.key} value={c.label} />
        ))}
      </datalist>
    </>
  );
}
