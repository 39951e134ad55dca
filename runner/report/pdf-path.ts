/** The PDF path of a report (`--pdf`): the same name with .pdf. Apart from pdf.ts so that using it loads no browser code. */
export function pdfPathFor(report: string): string {
  return report.replace(/\.html?$/i, "") + ".pdf";
}
