import { cn } from './cn';

/** A row of single-choice filter buttons with counts ("All 12", "Dug 3"). */
export function FilterChips<T extends string>({ label, options, value, onChange }: {
  label: string;
  options: { value: T; label: string; count: number }[];
  value: T;
  onChange: (value: T) => void;
}) {
  return (
    <div role="group" aria-label={label} className="relative -mx-3 flex gap-2 overflow-x-auto px-3 pb-1 sm:mx-0 sm:flex-wrap sm:px-0">
      {options.map((option) => (
        <button
          key={option.value}
          type="button"
          aria-pressed={value === option.value}
          onClick={() => onChange(option.value)}
          className={cn(
            'inline-flex min-h-10 shrink-0 items-center gap-1.5 rounded-full border px-3 text-sm whitespace-nowrap',
            value === option.value ? 'border-brand-700 bg-brand-700 text-white' : 'border-ink-300 bg-white text-ink-700 hover:bg-ink-100',
          )}
        >
          {option.label}
          <span className={cn('text-xs tabular', value === option.value ? 'text-brand-100' : 'text-ink-500')}>{option.count}</span>
        </button>
      ))}
    </div>
  );
}
