import { useId, useState, type Ref } from 'react';
import { Input } from '../../../components/ui/input';

export interface ItemChoice {
  /** "i:<ingredient id>" or "p:<preparation id>". */
  key: string;
  label: string;
}

/**
 * A searchable choice of ingredient or preparation: type to narrow the list,
 * pick a name. The field's value is the item's key; typed text that names no
 * item leaves it empty, and the form says so. The form's ref reaches the box, so a new line
 * and a line the server refused can take the focus there.
 */
export function ItemPicker({ id, value, choices, onChange, onBlur, invalid, describedBy, label, disabled, ref }: {
  id: string;
  value: string;
  choices: readonly ItemChoice[];
  onChange: (key: string) => void;
  onBlur?: () => void;
  invalid?: boolean;
  describedBy?: string;
  label: string;
  disabled?: boolean;
  ref?: Ref<HTMLInputElement>;
}) {
  const listId = useId();
  const [text, setText] = useState(() => choices.find((c) => c.key === value)?.label ?? '');
  return (
    <>
      <Input
        ref={ref}
        id={id}
        list={listId}
        value={text}
        autoComplete="off"
        placeholder="Type to search"
        aria-label={label}
        aria-describedby={describedBy}
        invalid={invalid}
        disabled={disabled}
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
