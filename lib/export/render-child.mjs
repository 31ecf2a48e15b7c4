// Entry of the export child process: receives one Vega-Lite spec over IPC, answers its SVG or the error message, exits.
// The parent (render-in-child.ts) starts it with a heap limit and a wall-time limit, so a heavy view cannot take the server down.
import { vegaLiteToSvg } from './vega-svg.mjs';

process.once('message', async (spec) => {
  let answer;
  try {
    answer = { svg: await vegaLiteToSvg(spec) };
  } catch (error) {
    answer = { error: error instanceof Error ? error.message : String(error) };
  }
  process.send(answer, () => process.exit(0));
});
