import type { FlagCode } from '../../lib/reduction/types';
import { explainFlag } from './flag-glossary';

interface Props {
  code: FlagCode;
  /** link to the glossary entry on the same page (FlagGlossary renders ids `flag-{code}`) */
  linkToGlossary?: boolean;
}

/** A flag as a chip in words; the code and the plain explanation are in the tooltip. */
export default function FlagChip({ code, linkToGlossary = false }: Props) {
  const f = explainFlag(code);
  const className = `inline-flex items-center gap-1 whitespace-nowrap rounded border px-1.5 py-0.5 text-xs ${
    f.safety ? 'border-flag bg-flag/10 font-bold text-ink-950' : 'border-ink-800/30 bg-ink-50 text-ink-900'
  }`;
  const body = (
    <>
      {f.safety && <span aria-hidden="true">⚠</span>}
      {f.title}
    </>
  );
  if (linkToGlossary)
    return (
      <a href={`#flag-${code}`} className={`${className} hover:bg-ink-100`} title={`${f.meaning} (flag code: ${code})`}>
        {body}
      </a>
    );
  return (
    <span className={className} title={`${f.meaning} (flag code: ${code})`} data-flag={code}>
      {body}
    </span>
  );
}
