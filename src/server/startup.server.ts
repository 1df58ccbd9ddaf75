// Imported first by the built server entry (astro.config.mjs): the app refuses to start with an
// unsafe configuration before it listens on any port.
import { assertSafeToStart } from './startup-checks.server';

assertSafeToStart('server');
