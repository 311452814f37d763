/**
 * Runs in the browser before the app's own code. zod 4 probes whether it may compile parsers with
 * `new Function`; under our Content-Security-Policy (no 'unsafe-eval') that probe is refused and
 * reported as a violation even though zod falls back. jitless skips the probe: same results.
 */
import { config } from 'zod/v4/core';

config({ jitless: true });
