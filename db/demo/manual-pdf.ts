// Turns the invented manuals of manual-content.ts into real PDFs with pdf-lib: a running header,
// ATA-numbered sections of five pages each (description, procedure, limits and figure,
// troubleshooting, record),
// and, where asked, a page that is only a scanned image of text.
import { mkdtemp, readFile, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { PDFDocument, StandardFonts, rgb, type PDFFont, type PDFPage } from "pdf-lib";
import { runTool } from "@/lib/server/pdf/tools";
import { wrapLine } from "@/lib/server/pdf/wrap";
import type { DemoManual, DemoSection } from "./manual-content";

const pageSize: [number, number] = [612, 792]; // US letter, points
const margin = 54;
const width = pageSize[0] - 2 * margin;
export const pagesPerSection = 5;

interface Fonts {
  regular: PDFFont;
  bold: PDFFont;
}

function wrap(text: string, font: PDFFont, size: number, maxWidth = width): string[] {
  return wrapLine(text, font, size, maxWidth);
}

class Writer {
  page!: PDFPage;
  y = 0;
  pageNumber = 0;

  constructor(
    private readonly doc: PDFDocument,
    private readonly fonts: Fonts,
    private readonly manual: DemoManual,
    private readonly revisionLabel: string,
    private readonly revisionDate: string,
  ) {}

  newPage(section: DemoSection, part: string) {
    this.page = this.doc.addPage(pageSize);
    this.pageNumber++;
    this.y = pageSize[1] - margin;
    // The section heading comes first on the page: it is what a reader (and search) looks for.
    this.text(`${section.code} ${section.title.toUpperCase()} - ${part}`, { font: this.fonts.bold, size: 13 });
    this.text(`${this.manual.title} | ${this.revisionLabel} | ${this.revisionDate}`, { size: 8, color: 0.35 });
    this.y -= 10;
    this.page.drawText(`Page ${this.pageNumber}   ${section.code}   ${this.manual.publisher}`, {
      x: margin,
      y: margin / 2,
      size: 8,
      font: this.fonts.regular,
      color: rgb(0.35, 0.35, 0.35),
    });
  }

  text(value: string, options: { font?: PDFFont; size?: number; indent?: number; color?: number } = {}) {
    const font = options.font ?? this.fonts.regular;
    const size = options.size ?? 10.5;
    const indent = options.indent ?? 0;
    for (const line of wrap(value, font, size, width - indent)) {
      this.page.drawText(line, {
        x: margin + indent,
        y: this.y - size,
        size,
        font,
        color: rgb(options.color ?? 0, options.color ?? 0, options.color ?? 0),
      });
      this.y -= size * 1.45;
    }
  }

  gap(points = 8) {
    this.y -= points;
  }

  hazard(kind: "WARNING" | "CAUTION" | "NOTE", value: string) {
    this.text(kind, { font: this.fonts.bold, size: 11 });
    this.text(value, { indent: 14 });
    this.gap();
  }
}

function describe(manual: DemoManual, section: DemoSection): string[] {
  const models = manual.applicability.join(", ");
  const first = section.steps[0]?.replace(/\.$/, "").toLowerCase() ?? "prepare the work area";
  return [
    `This section gives the ${section.title.toLowerCase()} procedure for the ${models}. Read the whole procedure before you start, and have the tools, parts and consumables at hand.`,
    `The work starts when you ${first}. Each step is done in the order shown; a step that cannot be done as written is stopped and reported to the instructor.`,
    `Values in this section are in the units shown. Where a value is given as a range, the result must fall inside the range. Record each measured value on the inspection record at the end of this section.`,
  ];
}

async function scannedImage(lines: string[]): Promise<Uint8Array> {
  // A text page rendered to pixels by pdftoppm: what a scanner would give, with no text layer.
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.Helvetica);
  const bold = await doc.embedFont(StandardFonts.HelveticaBold);
  const page = doc.addPage(pageSize);
  let y = pageSize[1] - 80;
  lines.forEach((line, i) => {
    page.drawText(line, { x: 60, y, size: i === 0 ? 16 : 14, font: i === 0 ? bold : font });
    if (i > 0) page.drawLine({ start: { x: 60, y: y - 20 }, end: { x: 552, y: y - 20 }, thickness: 0.8 });
    y -= 56;
  });
  const dir = await mkdtemp(path.join(tmpdir(), "hangarleaf-scan-"));
  try {
    const file = path.join(dir, "form.pdf");
    await writeFile(file, await doc.save());
    const result = await runTool("pdftoppm", ["-r", "150", "-gray", "-png", "-singlefile", file, path.join(dir, "form")]);
    if (result.code !== 0) throw new Error(`pdftoppm failed: ${result.stderr}`);
    return await readFile(path.join(dir, "form.png"));
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

export async function renderManualPdf(manual: DemoManual, revision: { label: string; date: string }): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.setTitle(`${manual.title} ${revision.label}`);
  doc.setProducer("Hangarleaf demo seed");
  const fonts = { regular: await doc.embedFont(StandardFonts.Helvetica), bold: await doc.embedFont(StandardFonts.HelveticaBold) };
  const w = new Writer(doc, fonts, manual, revision.label, revision.date);

  for (const chapter of manual.chapters) {
    for (const section of chapter.sections) {
      w.newPage(section, "DESCRIPTION");
      w.text(`CHAPTER ${chapter.ata} ${chapter.title.toUpperCase()}`, { font: fonts.bold });
      w.gap();
      for (const paragraph of describe(manual, section)) {
        w.text(paragraph);
        w.gap();
      }

      w.newPage(section, "PROCEDURE");
      if (section.warning) w.hazard("WARNING", section.warning);
      if (section.caution) w.hazard("CAUTION", section.caution);
      if (section.note) w.hazard("NOTE", section.note);
      section.steps.forEach((step, i) => {
        w.text(`${i + 1}. ${step}`, { indent: 6 });
        w.gap(4);
      });

      w.newPage(section, "LIMITS AND FIGURE");
      if (section.limits?.length) {
        w.text("LIMITS", { font: fonts.bold });
        for (const [item, value] of section.limits) w.text(`${item}: ${value}`, { indent: 10 });
      } else {
        w.text("No limits apply to this section beyond those of the standard practices chapter.");
      }
      w.gap(16);
      w.page.drawRectangle({ x: margin, y: w.y - 260, width, height: 250, borderColor: rgb(0.2, 0.2, 0.2), borderWidth: 1 });
      w.y -= 275;
      w.text(`Figure ${section.code.slice(0, 5)}-1. ${section.title}, general arrangement (drawing not to scale).`, { size: 9 });

      w.newPage(section, "TROUBLESHOOTING");
      w.text("If a result is outside the limits, stop and use this table before going on.");
      w.gap();
      for (const [item] of section.limits ?? [["Result of the procedure", ""]]) {
        w.text(`${item} out of limits: check the measuring tool and its calibration date, measure again, then report to the instructor.`, {
          indent: 6,
        });
        w.gap(4);
      }
      w.text("Do not adjust beyond the limits to make a reading fit. Record the reading as found.", { indent: 6 });

      w.newPage(section, "INSPECTION RECORD");
      w.text("Record each step, the value measured where there is one, and your initials.");
      w.gap();
      section.steps.forEach((_, i) => w.text(`Step ${i + 1}   value ____________   initials ______   instructor ______`, { indent: 6 }));

      if (manual.scannedPage?.afterSection === section.code) {
        const png = await doc.embedPng(await scannedImage(manual.scannedPage.lines));
        const page = doc.addPage(pageSize);
        w.pageNumber++;
        page.drawImage(png, { x: 0, y: 0, width: pageSize[0], height: pageSize[1] });
      }
    }
  }
  return doc.save();
}

/** The pages of a rendered manual, section by section, as the tests expect them. */
export function expectedPageCount(manual: DemoManual): number {
  const sections = manual.chapters.reduce((n, c) => n + c.sections.length, 0);
  return sections * pagesPerSection + (manual.scannedPage ? 1 : 0);
}

const sectionParts = ["description", "procedure", "limits", "troubleshooting", "record"] as const;

/** The page number of one part of a section ("74-10-00", "procedure"), as renderManualPdf lays it out. */
export function sectionPage(manual: DemoManual, code: string, part: (typeof sectionParts)[number] = "procedure"): number {
  let page = 1;
  for (const chapter of manual.chapters) {
    for (const section of chapter.sections) {
      if (section.code === code) return page + sectionParts.indexOf(part);
      page += pagesPerSection + (manual.scannedPage?.afterSection === section.code ? 1 : 0);
    }
  }
  throw new Error(`No section ${code} in ${manual.title}`);
}
