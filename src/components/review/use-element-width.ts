// The width of an element in CSS pixels, followed with a ResizeObserver, so an SVG can use a
// viewBox as wide as its box and draw text at true size on a laptop and on a large monitor.
import { useEffect, useRef, useState } from 'react';

/** `fallback` during SSR and before the first measurement. */
export function useElementWidth<T extends HTMLElement>(fallback: number) {
  const ref = useRef<T>(null);
  const [width, setWidth] = useState(fallback);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    setWidth(Math.max(1, Math.floor(el.clientWidth)) || fallback);
    const observer = new ResizeObserver((entries) => {
      const w = Math.floor(entries[0]?.contentRect.width ?? 0);
      if (w > 0) setWidth(w);
    });
    observer.observe(el);
    return () => observer.disconnect();
  }, [fallback]);
  return [ref, width] as const;
}
