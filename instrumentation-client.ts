// Runs in the browser before the app's own code. Zod compiles fast object parsers with
// `new Function` after probing whether eval is allowed; under our Content-Security-Policy
// (no 'unsafe-eval', see next.config.mjs) the probe fails harmlessly but the browser still
// reports a CSP violation. jitless skips the probe; parsing a form is fast enough without it.
import { z } from "zod";

z.config({ jitless: true });
