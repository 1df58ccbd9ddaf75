// Where to send someone after signing in: only a path on this site. `/\evil.example`,
// `//evil.example`, `https://evil.example` and anything with control characters fall back to `/`
// (browsers read a backslash as a slash, so `/\host` would leave the site).

/** A same-origin path (with query and fragment) from an untrusted `next`, or `/`. */
export function safeNextPath(next: string | null | undefined): string {
  if (!next || next.length > 2000) return '/';
  if (!next.startsWith('/') || next.startsWith('//') || next.includes('\\') || hasControlCharacter(next)) return '/';
  let url: URL;
  try {
    url = new URL(next, 'https://hoopline.invalid');
  } catch {
    return '/';
  }
  if (url.origin !== 'https://hoopline.invalid') return '/';
  return url.pathname + url.search + url.hash;
}

function hasControlCharacter(s: string): boolean {
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    if (c < 0x20 || c === 0x7f) return true;
  }
  return false;
}
