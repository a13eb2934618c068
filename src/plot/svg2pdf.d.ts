// svg2pdf.js's `main` is a UMD file that fails to load in Node from a `"type": "module"` package, so
// Node imports the ES build by path; it has the same exports as the package.
declare module 'svg2pdf.js/dist/svg2pdf.es.min.js' {
  export * from 'svg2pdf.js';
}
