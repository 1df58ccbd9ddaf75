/** A labelled progress bar in the house colours (the native <progress> ignores the palette). */
export default function ProgressBar({ value, label }: { value: number; label: string }) {
  const pct = Math.max(0, Math.min(100, Math.round(value)));
  return (
    <div
      role="progressbar"
      aria-label={label}
      aria-valuemin={0}
      aria-valuemax={100}
      aria-valuenow={pct}
      className="h-3 w-full overflow-hidden rounded-full bg-ink-100"
    >
      <div className="h-full rounded-full bg-ink-700 transition-[width] duration-300" style={{ width: `${pct}%` }} />
    </div>
  );
}
