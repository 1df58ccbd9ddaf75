// Runs in every integration test worker: point the app's modules at the test services.
import { inject } from 'vitest';
Object.assign(process.env, inject('env'));
