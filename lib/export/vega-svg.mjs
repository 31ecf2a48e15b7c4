// Plain-JavaScript core of the server chart: Vega-Lite compile and a headless Vega view (interpreter, refusing loader) to
// an SVG string. Plain .mjs so that the export child process (render-child.mjs) can load it without a TypeScript step.
import * as vega from 'vega';
import { expressionInterpreter } from 'vega-interpreter';
import { compile } from 'vega-lite';

/** A vega loader that refuses every URL and file: charts carry their data inline, so nothing may be read from outside. */
function refusingLoader() {
  const base = vega.loader();
  const refuse = async (uri) => {
    throw new Error(`chart specs may not load external data (${JSON.stringify(uri)}); data must be inline`);
  };
  return Object.assign(base, { load: refuse, sanitize: refuse, http: refuse, file: refuse });
}

/**
 * The SVG of a Vega-Lite spec as Vega writes it (ids not yet renumbered). Expressions are evaluated from their AST by
 * Vega's interpreter: no code is generated from spec text (no eval, no Function).
 *
 * @param {object} spec - a Vega-Lite spec with inline data
 * @returns {Promise<string>} the SVG document
 */
export async function vegaLiteToSvg(spec) {
  const vegaSpec = compile(spec).spec;
  const view = new vega.View(vega.parse(vegaSpec, undefined, { ast: true }), {
    renderer: 'none',
    loader: refusingLoader(),
    expr: expressionInterpreter,
  });
  try {
    return await view.toSVG();
  } finally {
    view.finalize();
  }
}
