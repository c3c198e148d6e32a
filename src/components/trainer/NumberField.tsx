import { useEffect, useState } from 'react';

// A number box that lets the learner type freely ("12.", "") and hands the store a number or null.

interface Props {
  id: string;
  value: number | null;
  onChange: (value: number | null) => void;
  step?: number;
  min?: number;
  integer?: boolean;
  className?: string;
  describedBy?: string;
}

const parse = (text: string, integer: boolean): number | null | undefined => {
  const trimmed = text.trim().replace(',', '.');
  if (trimmed === '') return null;
  const value = Number(trimmed);
  if (!Number.isFinite(value)) return undefined;
  return integer && !Number.isInteger(value) ? undefined : value;
};

export function NumberField({ id, value, onChange, step, min, integer = false, className, describedBy }: Props) {
  const [text, setText] = useState(value === null ? '' : String(value));

  // Follow changes made elsewhere (−/+ buttons, Try again, a restored draft) unless they match what is typed.
  useEffect(() => {
    if (parse(text, integer) !== value) setText(value === null ? '' : String(value));
  }, [value]);

  return (
    <input
      id={id}
      type="number"
      inputMode={integer ? 'numeric' : 'decimal'}
      step={step ?? (integer ? 1 : 'any')}
      min={min}
      value={text}
      aria-describedby={describedBy}
      className={className ?? 'field-input'}
      onChange={(event) => {
        setText(event.target.value);
        const parsed = parse(event.target.value, integer);
        if (parsed !== undefined && (parsed === null || min === undefined || parsed >= min)) onChange(parsed);
      }}
    />
  );
}
