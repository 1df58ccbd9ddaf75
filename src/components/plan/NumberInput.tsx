import { useEffect, useState, type InputHTMLAttributes } from 'react';
import { formatNumberForInput, parseNumberText, type NumberValue } from './plan-draft';

interface Props extends Omit<InputHTMLAttributes<HTMLInputElement>, 'value' | 'onChange' | 'type'> {
  id: string;
  value: unknown;
  /** a number, the raw text when it does not parse, or undefined when empty */
  onValue: (value: NumberValue) => void;
}

const same = (a: unknown, b: unknown) =>
  a === b || (typeof a === 'number' && typeof b === 'number' && Number.isNaN(a) && Number.isNaN(b));

/**
 * A text input for a number that keeps the exact value it was given (a unit conversion's
 * 70.866141732283… in) while showing six significant digits; only typing replaces the value.
 */
export default function NumberInput({ id, value, onValue, className, ...rest }: Props) {
  const [text, setText] = useState(() => formatNumberForInput(value));
  useEffect(() => {
    // A new value from outside (conversion, import, "use this"): show it, unless it is what the text says.
    setText((text) => (same(parseNumberText(text), value) ? text : formatNumberForInput(value)));
  }, [value]);
  const shown = formatNumberForInput(value);
  const exact = typeof value === 'number' && String(value) !== shown && text === shown ? String(value) : undefined;
  return (
    <input
      id={id}
      type="text"
      inputMode="decimal"
      autoComplete="off"
      spellCheck={false}
      className={`num field ${className ?? ''}`}
      value={text}
      title={exact ? `exact value ${exact}` : undefined}
      onChange={(e) => {
        setText(e.target.value);
        onValue(parseNumberText(e.target.value));
      }}
      {...rest}
    />
  );
}
