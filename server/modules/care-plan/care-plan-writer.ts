import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';

// The bundled Nunito Sans (latin subset, regular and bold); pdfkit's font reader takes WOFF as it is.
const require = createRequire(import.meta.url);
const FONT_REGULAR = require.resolve('@fontsource/nunito-sans/files/nunito-sans-latin-400-normal.woff');
const FONT_BOLD = require.resolve('@fontsource/nunito-sans/files/nunito-sans-latin-700-normal.woff');

export const INK = '#1f2933';
export const ALERT = '#9b1c1c';
const LINK = '#1d4ed8';

type Struct = PDFKit.PDFStructureElement;

/**
 * A tagged PDF (PDF 1.7, its language set, the title shown instead of the file name) and a writer whose every line
 * lands in the structure tree as a heading, paragraph or list item, so a screen reader reads the plan in order
 * with its headings and lists. Sections are `Sect` elements under one `Document`.
 */
export function openTaggedDocument(info: { title: string; author: string }) {
  const doc = new PDFDocument({
    size: 'A4', margin: 44, pdfVersion: '1.7', tagged: true, lang: 'en-GB', displayTitle: true,
    info: { Title: info.title, Author: info.author, Creator: 'Nestflow' },
  });
  doc.registerFont('Body', FONT_REGULAR);
  doc.registerFont('Bold', FONT_BOLD);
  const root = doc.struct('Document');
  doc.addStructure(root);
  const width = doc.page.width - doc.page.margins.left - doc.page.margins.right;
  let parent: Struct = root;

  const w = {
    doc,
    /** A section: its heading and everything written inside `body` belong to one `Sect`. */
    section(title: string, body: () => void, colour = INK) {
      const sect = doc.struct('Sect');
      root.add(sect);
      parent = sect;
      parent.add(doc.struct('H2', {}, () => {
        doc.moveDown(0.6).font('Bold').fontSize(13).fillColor(colour).text(title, { width }).moveDown(0.2);
        doc.fillColor(INK);
      }));
      body();
      sect.end();
      parent = root;
    },
    title(text: string) {
      parent.add(doc.struct('H1', {}, () => doc.font('Bold').fontSize(20).fillColor(INK).text(text, { width })));
    },
    para(text: string, bold = false) {
      parent.add(doc.struct('P', {}, () => doc.font(bold ? 'Bold' : 'Body').fontSize(10.5).text(text, { width, lineGap: 1.5 })));
    },
    /**
     * A web address as a paragraph that is also a link annotation over each of its lines: a long address wraps, and
     * text copied across the wrap picks up a space, but clicking it opens the whole address.
     */
    link(url: string) {
      parent.add(doc.struct('P', {}, () => {
        doc.font('Body').fontSize(10.5).fillColor(LINK).text(url, { width, lineGap: 1.5, link: url, underline: true });
        doc.fillColor(INK);
      }));
    },
    bullets(items: readonly string[]) {
      if (!items.length) return;
      const list = doc.struct('L');
      parent.add(list);
      doc.font('Body').fontSize(10.5).list([...items], { width, bulletRadius: 1.8, textIndent: 12, lineGap: 1.5, structParent: list });
      list.end();
    },
  };

  const finish = (): Promise<Buffer> => {
    const chunks: Buffer[] = [];
    const done = new Promise<Buffer>((resolve, reject) => {
      doc.on('data', (c: Buffer) => chunks.push(c));
      doc.on('end', () => resolve(Buffer.concat(chunks)));
      doc.on('error', reject);
    });
    root.end();
    doc.end();
    return done;
  };
  return { w, finish };
}
export type PlanWriter = ReturnType<typeof openTaggedDocument>['w'];
