// A small excerpt of the mechanic certification standard for the demo: a handful of elements in
// the standard's code form (AM.<section>.<area>.<kind><n>), so cards can be mapped and coverage
// shown before a school imports its own copy. It is NOT the standard: the area letters, the codes
// and the wording below are from memory and paraphrased, marked in the app as an excerpt to be
// verified against the current FAA-S-ACS-1, which the school imports as CSV (Standard page).
export const standardExcerptCsv = `code,area,element
AM.I.E.K1,"Aircraft Materials, Hardware, and Processes",Nondestructive testing methods and when each is used (excerpt; verify)
AM.I.E.S1,"Aircraft Materials, Hardware, and Processes",Perform a penetrant inspection (excerpt; verify)
AM.I.E.R1,"Aircraft Materials, Hardware, and Processes",Hazards of cleaning and inspection chemicals (excerpt; verify)
AM.II.A.K1,Metallic Structures,"Rivet selection, layout and installation (excerpt; verify)"
AM.II.A.S1,Metallic Structures,Install solid rivets (excerpt; verify)
AM.II.A.S2,Metallic Structures,Inspect installed solid rivets (excerpt; verify)
AM.II.C.S1,Flight Controls,Check control cable tension (excerpt; verify)
AM.II.E.R1,Landing Gear Systems,Hazards of jacking an aircraft (excerpt; verify)
AM.II.E.S1,Landing Gear Systems,Inspect a landing gear (excerpt; verify)
AM.III.G.S1,Ignition and Starting Systems,Time a magneto to an engine (excerpt; verify)
AM.III.O.S1,Propellers,Check propeller blade track (excerpt; verify)
AM.III.B.S1,Turbine Engines,Remove and install a turbine engine (excerpt; verify)
`;

/** The demo cards' steps mapped to the excerpt, by card title and step number (from 1). */
export const demoElementMap: Record<string, Record<number, string[]>> = {
  "Riveted splice patch on a practice skin panel": { 2: ["AM.II.A.K1"], 5: ["AM.II.A.S1"], 6: ["AM.II.A.S2"], 7: ["AM.II.A.S2"] },
  "Fluorescent penetrant inspection of a landing gear fitting": { 1: ["AM.I.E.R1"], 4: ["AM.I.E.S1", "AM.I.E.K1"] },
  "Magneto-to-engine timing check": { 3: ["AM.III.G.S1"] },
  "Aileron control cable tension check": { 2: ["AM.II.C.S1"] },
  "Main landing gear inspection on jacks": { 1: ["AM.II.E.R1"], 2: ["AM.II.E.S1"] },
  "Propeller track check": { 2: ["AM.III.O.S1"] },
  "Turbine engine removal and installation on the stand": { 4: ["AM.III.B.S1"] },
};
