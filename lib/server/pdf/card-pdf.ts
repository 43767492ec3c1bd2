// A task card version as a clean printable PDF (pdf-lib): header, the training notice, tools and
// protective equipment, each step with its notices before it, blanks for values and initials, the
// manual references, and a sign-off block. Plain TypeScript, no Next imports.
import { readFileSync } from "node:fs";
import path from "node:path";
import fontkit from "@pdf-lib/fontkit";
import { PDFDocument, rgb, type PDFFont, type PDFPage } from "pdf-lib";
import { calculators } from "@/lib/domain/calc";
import { describeLimit } from "@/lib/domain/calc/limits";
import { unitLabel } from "@/lib/domain/calc/units";
import { wrapLine } from "@/lib/server/pdf/wrap";
import type { CardVersionDto } from "@/lib/contracts/cards";
import { noticeLabels, sortNotices } from "@/lib/domain/validation/cards";

const pageSize: [number, number] = [612, 792];
const margin = 50;
const width = pageSize[0] - 2 * margin;
const black = rgb(0, 0, 0);
export const grey = rgb(0.35, 0.35, 0.35);

/** Markdown to the plain text a printed card shows: emphasis dropped, links as "text (address)". */
export function markdownToPlain(markdown: string): string {
  return markdown
    .replace(/```[\s\S]*?```/g, (block) => block.replace(/```\w*/g, ""))
    .replace(/!\[([^\]]*)\]\([^)]*\)/g, "$1")
    .replace(/\[([^\]]+)\]\(([^)\s]+)[^)]*\)/g, "$1 ($2)")
    .replace(/<[^>]+>/g, "")
    .replace(/^#{1,6}\s+/gm, "")
    .replace(/^\s*[-*+]\s+/gm, "• ")
    .replace(/(\*\*|__)(.*?)\1/g, "$2")
    .replace(/(\*|_)(.*?)\1/g, "$2")
    .replace(/`([^`]*)`/g, "$1")
    .trim();
}

// Liberation Sans, the TrueType font pdf.js ships (the reader's text layer uses it too): it has
// Latin, Greek, Cyrillic and the trade's symbols (≤ ± ° √ Σ µ ½ −), so a card prints what it says.
// The standard PDF fonts speak WinAnsi only, which printed "?" for anything else.
const fontFile = (name: string) => path.join(process.cwd(), "node_modules", "pdfjs-dist", "standard_fonts", name);
let fonts: { regular: Uint8Array; bold: Uint8Array; has: (codePoint: number) => boolean } | null = null;
function cardFonts() {
  if (!fonts) {
    const regular = readFileSync(fontFile("LiberationSans-Regular.ttf"));
    const bold = readFileSync(fontFile("LiberationSans-Bold.ttf"));
    const face = fontkit.create(regular);
    fonts = { regular, bold, has: (cp) => face.hasGlyphForCodePoint(cp) };
  }
  return fonts;
}

/** The card's fonts in a document, subset so that only the glyphs used go into the file. */
export async function embedCardFonts(doc: PDFDocument): Promise<{ regular: PDFFont; bold: PDFFont }> {
  doc.registerFontkit(fontkit);
  const { regular, bold } = cardFonts();
  return { regular: await doc.embedFont(regular, { subset: true }), bold: await doc.embedFont(bold, { subset: true }) };
}

/** The few characters the font lacks, spelled out. */
const replacements: Record<string, string> = { "⌈": "", "⌉": "", "✓": "√", "✔": "√", "☐": "[ ]" };

/** Every character the font has prints as itself; the rest is spelled out or shown as "?", never a crash. */
export function printable(text: string): string {
  const { has } = cardFonts();
  let out = "";
  for (const ch of text.replace(/\t/g, "  ").replace(/\r\n?/g, "\n")) {
    if (ch === "\n" || has(ch.codePointAt(0)!)) out += ch;
    else out += replacements[ch] ?? "?";
  }
  return out;
}

export class CardWriter {
  page!: PDFPage;
  y = 0;
  pages: PDFPage[] = [];

  constructor(
    private doc: PDFDocument,
    private regular: PDFFont,
    private bold: PDFFont,
    private footer: string,
  ) {
    this.newPage();
  }

  newPage() {
    this.page = this.doc.addPage(pageSize);
    this.pages.push(this.page);
    this.y = pageSize[1] - margin;
  }

  ensure(height: number) {
    if (this.y - height < margin + 24) this.newPage();
  }

  wrap(text: string, font: PDFFont, size: number, maxWidth: number): string[] {
    // An empty paragraph stays as a blank line.
    return printable(text)
      .split("\n")
      .flatMap((paragraph) => {
        const lines = wrapLine(paragraph, font, size, maxWidth);
        return lines.length ? lines : [""];
      });
  }

  text(
    text: string,
    {
      size = 10.5,
      bold = false,
      indent = 0,
      color = black,
    }: { size?: number; bold?: boolean; indent?: number; color?: ReturnType<typeof rgb> } = {},
  ) {
    const font = bold ? this.bold : this.regular;
    for (const line of this.wrap(text, font, size, width - indent)) {
      this.ensure(size + 4);
      this.page.drawText(line, { x: margin + indent, y: this.y - size, size, font, color });
      this.y -= size + 4;
    }
  }

  gap(h = 6) {
    this.y -= h;
  }

  /** A list to tick off at the aircraft: one item a line, each with its own box. */
  checklist(items: readonly string[], indent = 8) {
    const size = 10.5;
    const box = 9;
    for (const item of items) {
      const lines = this.wrap(item, this.regular, size, width - indent - box - 8);
      this.ensure(lines.length * (size + 5));
      this.page.drawRectangle({ x: margin + indent, y: this.y - size, width: box, height: box, borderColor: black, borderWidth: 0.9 });
      for (const line of lines) {
        this.page.drawText(line, { x: margin + indent + box + 8, y: this.y - size, size, font: this.regular });
        this.y -= size + 4;
      }
      this.y -= 1;
    }
  }

  rule() {
    this.ensure(8);
    this.page.drawLine({ start: { x: margin, y: this.y }, end: { x: margin + width, y: this.y }, thickness: 0.6, color: grey });
    this.y -= 8;
  }

  /** A framed WARNING / CAUTION / NOTE, never split across pages. */
  notice(kind: "warning" | "caution" | "note", body: string) {
    const size = 10.5;
    const lines = this.wrap(body, this.regular, size, width - 20);
    const height = 22 + lines.length * (size + 4) + 8;
    this.ensure(height + 6);
    const top = this.y;
    this.page.drawRectangle({ x: margin, y: top - height, width, height, borderColor: black, borderWidth: kind === "note" ? 0.8 : 2 });
    const label = noticeLabels[kind];
    const labelWidth = this.bold.widthOfTextAtSize(label, 12);
    this.page.drawText(label, { x: margin + (width - labelWidth) / 2, y: top - 16, size: 12, font: this.bold });
    let y = top - 22;
    for (const line of lines) {
      this.page.drawText(line, { x: margin + 10, y: y - size, size, font: this.regular });
      y -= size + 4;
    }
    this.y = top - height - 6;
  }

  finish() {
    const total = this.pages.length;
    this.pages.forEach((page, i) => {
      const label = printable(`${this.footer}   ·   page ${i + 1} of ${total}`);
      page.drawText(label, { x: margin, y: margin - 20, size: 8.5, font: this.regular, color: grey });
    });
  }
}

export async function renderCardPdf(version: CardVersionDto, { printedAt = new Date() }: { printedAt?: Date } = {}): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.setTitle(`${version.title} (version ${version.number})`);
  doc.setProducer("Hangarleaf");
  doc.setCreationDate(printedAt);
  const { regular, bold } = await embedCardFonts(doc);
  const state =
    version.status === "published"
      ? `version ${version.number}, published ${version.publishedAt?.slice(0, 10) ?? ""}`
      : `DRAFT version ${version.number}, not for use on aircraft`;
  const w = new CardWriter(doc, regular, bold, `${version.title} - ${state}`);

  w.text("TASK CARD", { size: 9, bold: true, color: grey });
  w.text(version.title, { size: 17, bold: true });
  w.text(state, { size: 10, color: grey });
  w.gap(4);
  const facts = [
    version.ataChapter ? `ATA chapter ${version.ataChapter}` : null,
    version.subjectName ? `Subject: ${version.subjectName}` : null,
    version.applicability.length ? `Applicability: ${version.applicability.join(", ")}` : null,
    version.estimatedMinutes ? `Estimated time: ${version.estimatedMinutes} min` : null,
  ].filter(Boolean);
  if (facts.length) w.text(facts.join("   ·   "), { size: 10 });
  w.gap(4);
  w.text("Student ______________________   Date __________   Aircraft / station ______________________", { size: 10 });
  w.gap(6);
  w.notice(
    "note",
    "Training use. The current manufacturer's data, your instructor, local rules and licensed practice come first. Check every reference below against the current revision before work begins.",
  );

  for (const [label, items] of [
    ["Tools", version.tools],
    ["Consumables", version.consumables],
    ["Protective equipment", version.protectiveEquipment],
  ] as const) {
    if (!items.length) continue;
    w.text(label, { bold: true, size: 11 });
    w.checklist(items);
    w.gap(4);
  }
  w.rule();

  version.steps.forEach((step, i) => {
    w.ensure(60);
    w.text(`Step ${i + 1}${step.inspectionPoint ? "   INSPECTION POINT" : ""}`, { bold: true, size: 12.5 });
    w.gap(2);
    for (const n of sortNotices(step.notices)) w.notice(n.kind, n.text);
    if (step.text.trim()) w.text(markdownToPlain(step.text));
    w.gap(3);
    if (step.measurement) {
      const m = step.measurement;
      w.text(`${m.label}: measured ____________ ${unitLabel(m.unit)}    limits ${describeLimit(m)}    in limits  [ ] yes  [ ] no`, {
        indent: 8,
      });
    }
    if (step.timerMinutes) w.text(`Timer ${step.timerMinutes} min:  started ________  ended ________`, { indent: 8 });
    if (step.calculator)
      w.text(`Calculator: ${calculators[step.calculator].title} (training aid; check against the manufacturer's data).`, {
        indent: 8,
        size: 9.5,
      });
    for (const ref of step.references) {
      const quote = ref.quote ? ` - "${ref.quote}"` : "";
      w.text(
        `Ref: ${ref.manualTitle}, ${ref.revisionLabel}, page ${ref.page}${ref.current ? "" : " (SUPERSEDED revision: check the current one)"}${quote}`,
        { indent: 8, size: 9.5, color: grey },
      );
    }
    w.gap(3);
    w.text(step.inspectionPoint ? "Student initials ______    Instructor buy-off ______  date ________" : "Student initials ______", {
      indent: 8,
    });
    w.gap(4);
    w.rule();
  });

  w.ensure(80);
  w.text("Sign-off", { bold: true, size: 12.5 });
  w.text("Student ______________________  date ________      Instructor ______________________  date ________");
  w.gap(8);
  w.text(
    `Printed ${printedAt.toISOString().slice(0, 16).replace("T", " ")} UTC from Hangarleaf. A printed card is a copy: the card in Hangarleaf is the one that counts.`,
    { size: 8.5, color: grey },
  );
  w.finish();
  return doc.save();
}
