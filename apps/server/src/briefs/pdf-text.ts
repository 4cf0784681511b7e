import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';

/** For tests: a PDF's text (pdf.js, items joined by spaces) and its metadata, page by page. */
export async function pdfText(bytes: Buffer): Promise<{ pages: string[]; text: string; info: Record<string, unknown> }> {
  const pdf = await getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, isEvalSupported: false }).promise;
  const pages: string[] = [];
  for (let n = 1; n <= pdf.numPages; n++) {
    const content = await (await pdf.getPage(n)).getTextContent();
    pages.push(
      content.items
        .map((item) => ('str' in item ? item.str : ''))
        .join(' ')
        .replace(/\s+/g, ' '),
    );
  }
  const { info } = await pdf.getMetadata();
  await pdf.destroy();
  return { pages, text: pages.join(' '), info: info as Record<string, unknown> };
}
