// The tool room's label sheet: A4, 3 × 8 labels, each a QR code of the number (what a scanner
// types back at the desk), the number in large type, what it is, and a precision tool's
// calibration due date. The QR matrix comes from the qrcode package and is drawn as squares, so
// the labels stay sharp at any printer's resolution.
import "server-only";
import QRCode from "qrcode";
import { PDFDocument, rgb } from "pdf-lib";
import { embedCardFonts, printable } from "@/lib/server/pdf/card-pdf";
import { listKits, listTools } from "@/lib/server/tools/catalogue";

const black = rgb(0, 0, 0);
const pageSize = { width: 595.28, height: 841.89 };
const columns = 3;
const rows = 8;
const margin = { x: 20, y: 30 };

interface Label {
  number: string;
  title: string;
  detail: string;
}

export async function toolLabelsPdf({ kitId }: { kitId?: string } = {}): Promise<Uint8Array> {
  const [kits, tools] = await Promise.all([listKits(), listTools()]);
  const labels: Label[] = [
    ...kits
      .filter((k) => !kitId || k.id === kitId)
      .map((k) => ({ number: k.number, title: k.name, detail: `Kit of ${k.tools.length} tool${k.tools.length === 1 ? "" : "s"}` })),
    ...tools
      .filter((t) => !kitId || t.kitId === kitId)
      .map((t) => ({
        number: t.number,
        title: t.description,
        detail: t.calibrated ? `Calibration due ${t.calibrationDueOn ?? "not recorded"}` : t.kitNumber ? `In kit ${t.kitNumber}` : "",
      })),
  ];
  const doc = await PDFDocument.create();
  doc.setTitle("Tool room labels");
  const { regular, bold } = await embedCardFonts(doc);
  const cell = { width: (pageSize.width - 2 * margin.x) / columns, height: (pageSize.height - 2 * margin.y) / rows };
  if (!labels.length) {
    doc.addPage([pageSize.width, pageSize.height]).drawText("No tools or kits to label.", { x: 60, y: 760, size: 14, font: regular });
  }
  labels.forEach((label, i) => {
    const slot = i % (columns * rows);
    const page = slot === 0 ? doc.addPage([pageSize.width, pageSize.height]) : doc.getPage(doc.getPageCount() - 1);
    const x = margin.x + (slot % columns) * cell.width;
    const top = pageSize.height - margin.y - Math.floor(slot / columns) * cell.height;
    page.drawRectangle({
      x: x + 2,
      y: top - cell.height + 2,
      width: cell.width - 4,
      height: cell.height - 4,
      borderColor: rgb(0.7, 0.7, 0.7),
      borderWidth: 0.5,
    });
    // Error correction M: a label scuffed in a toolbox still reads.
    const qr = QRCode.create(label.number, { errorCorrectionLevel: "M" });
    const side = cell.height - 22;
    const cellSide = side / (qr.modules.size + 8); // four modules of quiet zone each side
    const qx = x + 8 + 4 * cellSide;
    const qy = top - 11 - 4 * cellSide;
    for (let r = 0; r < qr.modules.size; r++)
      for (let c = 0; c < qr.modules.size; c++)
        if (qr.modules.get(r, c))
          page.drawRectangle({ x: qx + c * cellSide, y: qy - (r + 1) * cellSide, width: cellSide, height: cellSide, color: black });
    const tx = x + 8 + side + 4;
    const width = cell.width - (tx - x) - 8;
    const fit = (text: string, size: number, font = regular) => {
      let t = printable(text);
      while (t.length > 1 && font.widthOfTextAtSize(t, size) > width) t = `${t.slice(0, -2)}…`;
      return t;
    };
    page.drawText(fit(label.number, 16, bold), { x: tx, y: top - 30, size: 16, font: bold });
    page.drawText(fit(label.title, 8.5), { x: tx, y: top - 46, size: 8.5, font: regular });
    if (label.detail) page.drawText(fit(label.detail, 7.5), { x: tx, y: top - 58, size: 7.5, font: regular });
    page.drawText("Hangarleaf tool room", { x: tx, y: top - cell.height + 12, size: 6.5, font: regular, color: rgb(0.35, 0.35, 0.35) });
  });
  return doc.save();
}
