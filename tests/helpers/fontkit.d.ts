/** The few calls the report tests make of fontkit (pdfkit's own font reader, installed with it). */
declare module "fontkit" {
  const fontkit: { openSync(path: string): unknown };
  export default fontkit;
}
