import { PDFDocument, StandardFonts } from "pdf-lib";

/** A PDF with one page per entry, each page holding that text. */
export async function makePdf(pageTexts: string[]): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.Helvetica);
  for (const text of pageTexts) {
    const page = doc.addPage([612, 792]);
    text.split("\n").forEach((line, i) => page.drawText(line, { x: 54, y: 720 - i * 16, size: 12, font }));
  }
  return doc.save();
}
