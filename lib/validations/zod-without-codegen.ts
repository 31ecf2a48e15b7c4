// zod without generated code in the browser: zod 4 compiles a fast path for object schemas with Function() and probes for
// it when the first object schema is built; the CSP forbids eval, so the probe alone would report a violation.
// Imported by instrumentation-client.ts, which Next runs before the app's modules (schemas are built at module load).
import { z } from 'zod';

z.config({ jitless: true });
