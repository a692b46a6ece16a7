type Option = { value: string | number; label: string };

type Props = {
  label: string;
  value: string | number | undefined;
  options: Option[];
  /** Text of the first option, which means "no filter"; omit for a required choice. */
  anyLabel?: string;
  onChange: (value: string | undefined) => void;
};

/** A labelled select for filters and small choices; the empty option clears the filter. */
export function FilterSelect({ label, value, options, anyLabel, onChange }: Props) {
  return (
    <label className="flex flex-col">
      {label}
      <select className="rounded-md border border-line bg-field px-2 py-1" value={value ?? ''} onChange={(e) => onChange(e.target.value || undefined)}>
        {anyLabel !== undefined ? <option value="">{anyLabel}</option> : null}
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </label>
  );
}

export const keyedOptions = (items: { key: string; label: string }[]): Option[] => items.map((i) => ({ value: i.key, label: i.label }));
