// Compiling a Vega-Lite spec with a logger that collects its warnings and errors (dropped encodings, bad scales…),
// so that chart tests can ask for a spec that compiles cleanly.
import { compile } from 'vega-lite';

/** Vega-Lite warnings and errors of a spec (empty when it compiles cleanly). */
export function vegaLiteWarnings(spec: unknown): string[] {
  const warnings: string[] = [];
  const logger = {
    level: () => logger,
    error: (...m: unknown[]) => (warnings.push(`error: ${m.join(' ')}`), logger),
    warn: (...m: unknown[]) => (warnings.push(m.join(' ')), logger),
    info: () => logger,
    debug: () => logger,
  };
  compile(spec as never, { logger: logger as never });
  return warnings;
}
