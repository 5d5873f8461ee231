// pdfkit ships its standard-font metrics as modules without type declarations.
declare module 'pdfkit/standard-fonts/Helvetica' {
  const font: { name: string };
  export default font;
}
declare module 'pdfkit/standard-fonts/HelveticaBold' {
  const font: { name: string };
  export default font;
}
