/** A small button in a table row; screen readers hear whose row it acts on ("Edit Aster Gale"). */
export function RowButton({
  label,
  who,
  onClick,
  disabled,
}: {
  label: string;
  who: string;
  onClick: () => void;
  disabled?: boolean;
}) {
  return (
    <button
      type="button"
      className="btn-quiet px-2 py-1 text-xs"
      onClick={onClick}
      disabled={disabled}
      aria-label={`${label} ${who}`}
    >
      {label}
    </button>
  );
}
