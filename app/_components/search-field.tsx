// The search box above a list or tree; its label is for screen readers, the placeholder shows what it matches.

type SearchFieldProps = { label: string; placeholder: string; value: string; onChange: (value: string) => void };

export function SearchField({ label, placeholder, value, onChange }: SearchFieldProps) {
  return (
    <label className="block">
      <span className="sr-only">{label}</span>
      <input
        type="search"
        className="field w-56"
        placeholder={placeholder}
        value={value}
        onChange={(e) => onChange(e.target.value)}
      />
    </label>
  );
}
