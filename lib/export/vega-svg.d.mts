// Types of vega-svg.mjs (plain JavaScript so the export child process can load it): a Vega-Lite spec to Vega's SVG string.
// The implementation and its documentation live in vega-svg.mjs.
export declare function vegaLiteToSvg(spec: object): Promise<string>;
