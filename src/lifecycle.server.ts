// Process lifecycle: what must be closed when the process stops (the database pool), and
// whether it is draining (readiness then answers 503 so a load balancer stops sending). It
// lives on one object on globalThis because the web server's wrapper (scripts/serve.mjs) and
// the built app are separate module graphs in one process. Sits below the database layer,
// beside the config, and imports nothing of the app.

const KEY = Symbol.for('hoopline.lifecycle');

export interface Lifecycle {
  draining: boolean;
  closers: Map<string, () => Promise<void>>;
}

export function lifecycle(): Lifecycle {
  const g = globalThis as { [KEY]?: Lifecycle };
  return (g[KEY] ??= { draining: false, closers: new Map() });
}

/** Run `close` when the process shuts down (one per name; a later one replaces it). */
export function onShutdown(name: string, close: () => Promise<void>): void {
  lifecycle().closers.set(name, close);
}

export function isDraining(): boolean {
  return lifecycle().draining;
}

export function startDraining(): void {
  lifecycle().draining = true;
}

/** Run every shutdown hook once, newest first; a failing hook does not stop the others. */
export async function runShutdownHooks(): Promise<void> {
  const { closers } = lifecycle();
  const hooks = [...closers.values()].reverse();
  closers.clear();
  for (const close of hooks) await close().catch(() => undefined);
}
