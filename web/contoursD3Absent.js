// On the web, calc/lightmap.ts's reference contour engine (d3-contour, the `contourEngine: 'd3'` option that
// tests and benchmarks use in Node) stands in here (metro.config.js): the app always draws with the fast
// tracer, and d3-contour with d3-array is about 28 KB of the share page.
export function contourLinesD3() {
  throw new Error("the d3 contour engine is not part of the web build (metro.config.js); use contourEngine: 'fast'");
}
