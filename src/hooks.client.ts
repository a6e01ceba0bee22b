// The browser side runs under a Content-Security-Policy without 'unsafe-eval' (svelte.config.js).
// zod probes whether it may compile validators with `new Function`; the probe's failure is
// caught, but the browser still reports it as a policy violation. Jitless mode skips the probe
// (zod's own advice for strict CSPs); validation is the same, only not compiled.
import { z } from 'zod';

z.config({ jitless: true });
