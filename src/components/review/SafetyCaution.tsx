interface Props {
  /** one line instead of the full paragraph, for tight spaces */
  compact?: boolean;
}

/** A standing caution: stored energy, the procedure and code govern, the comparison only supports judgement. */
export default function SafetyCaution({ compact = false }: Props) {
  return (
    <aside
      role="note"
      aria-label="Safety caution"
      className="flex gap-3 rounded-md border-l-4 border-caution bg-brass-100 px-4 py-3 text-sm text-ink-950"
    >
      <span aria-hidden="true" className="text-lg leading-5">
        ⚠
      </span>
      {compact ? (
        <p>
          A pressurised vessel stores energy. Follow the test procedure and the governing code; this comparison
          supports, and does not replace, the responsible engineer and the authorised inspector.
        </p>
      ) : (
        <div className="space-y-1">
          <p className="font-semibold">
            A vessel under test pressure stores energy, and a failure can release it violently.
          </p>
          <p>
            Follow the written test procedure and the governing code and jurisdiction: they set the test pressure, the
            holds, the exclusion zone and who may approach the vessel.
          </p>
          <p>
            Hoopline compares measured strain with elastic theory. It supports, and does not replace, the judgement of
            the responsible engineer and the authorised inspector.
          </p>
        </div>
      )}
    </aside>
  );
}
