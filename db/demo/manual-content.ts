// The invented manuals of the demo school, as data: chapters, sections and their text. Every
// model, value and name here is made up for training the software, not for any aircraft.
// db/demo/manual-pdf.ts turns them into PDFs; the tests read the same data to know what to expect.
// The penetrant procedure's temperature window is the calculator's (lib/domain/calc/ndt.ts), so the
// procedure, the demo card and the calculator cannot disagree.
import { penetrantWindowF } from "@/lib/domain/calc/ndt";

export interface DemoSection {
  code: string; // ATA-style chapter-section-subject, e.g. 32-10-00
  title: string;
  warning?: string;
  caution?: string;
  note?: string;
  steps: string[];
  limits?: [string, string][];
}

export interface DemoChapter {
  ata: string;
  title: string;
  sections: DemoSection[];
}

export interface DemoManual {
  title: string;
  documentType: "maintenance_manual" | "overhaul_manual" | "handbook" | "school_procedure";
  applicability: string[];
  publisher: string;
  chapters: DemoChapter[];
  /** A page that is only a picture of text, with no text layer: OCR reads it. */
  scannedPage?: { afterSection: string; lines: string[] };
}

const engineWarning =
  "Make sure the magneto switch is OFF and the ignition leads are grounded before you turn the propeller. A live magneto can fire the engine and the propeller can kill.";
const jackWarning =
  "Jack the aircraft only on level ground, at the jacking points, with the locking collars set. A falling aircraft can crush a person.";
const chemicalWarning =
  "Penetrant, remover and developer are flammable and irritate skin and eyes. Wear nitrile gloves and eye protection, work with ventilation, and keep flames away.";
const uvWarning =
  "Do not look into the UV-A lamp. Wear UV-blocking glasses. Replace a cracked filter before use: unfiltered light burns skin and eyes.";

export const demoManuals: DemoManual[] = [
  {
    title: "HT-20 Trainer Maintenance Manual",
    documentType: "maintenance_manual",
    applicability: ["HT-20"],
    publisher: "Halvard Light Aircraft Works (invented)",
    chapters: [
      {
        ata: "05",
        title: "Time Limits and Maintenance Checks",
        sections: [
          {
            code: "05-10-00",
            title: "Time Limits",
            steps: [
              "Record the hours of each component in the logbook after each flight day.",
              "Compare the hours with the life limits table before each check.",
              "Replace a component that reaches its limit before the next flight.",
            ],
            limits: [
              ["Magneto inspection", "every 500 hours"],
              ["Propeller overhaul", "2000 hours or 6 years"],
              ["Fuel hoses", "replace at 5 years"],
            ],
          },
          {
            code: "05-20-00",
            title: "Scheduled Inspection Intervals",
            note: "An inspection interval may be exceeded by 10 hours only to fly the aircraft to the place of inspection.",
            steps: [
              "Open the inspection checklist for the interval due.",
              "Remove the panels listed for that interval.",
              "Do each item and initial it on the checklist.",
              "Install the panels and make the logbook entry.",
            ],
          },
        ],
      },
      {
        ata: "12",
        title: "Servicing",
        sections: [
          {
            code: "12-10-00",
            title: "Fuel Servicing",
            warning: "Ground the aircraft and the fuel nozzle before you open a fuel cap. A static spark can ignite fuel vapour.",
            steps: [
              "Park the aircraft clear of buildings with the fire extinguisher at hand.",
              "Connect the grounding cable to the exhaust stack.",
              "Fill each tank to the tab for training flights.",
              "Drain a sample from each sump and check for water and sediment.",
            ],
            limits: [
              ["Usable fuel, each tank", "19 US gal"],
              ["Fuel grade", "100LL, blue"],
            ],
          },
          {
            code: "12-20-00",
            title: "Tire Servicing",
            caution: "Do not inflate a tire above the limit: an overinflated tire can burst.",
            steps: [
              "Check the pressure with a calibrated gauge when the tires are cold.",
              "Inflate with dry nitrogen or air through the valve core.",
              "Look for cuts, bulges and worn tread and record what you find.",
            ],
            limits: [
              ["Main wheel tire pressure", "38 to 42 psi"],
              ["Nose wheel tire pressure", "30 to 34 psi"],
            ],
          },
          {
            code: "12-30-00",
            title: "Engine Oil Servicing",
            steps: [
              "Check the oil level 5 to 10 minutes after engine shutdown.",
              "Add oil of the approved grade through the filler neck.",
              "Do not fill above the full mark on the dipstick.",
            ],
            limits: [
              ["Oil capacity", "6 US qt"],
              ["Minimum oil for flight", "4 US qt"],
            ],
          },
        ],
      },
      {
        ata: "20",
        title: "Standard Practices - Airframe",
        sections: [
          {
            code: "20-10-00",
            title: "Torque Values",
            note: "Torque values are for clean, dry threads unless the table says lubricated.",
            steps: [
              "Find the fastener size in the torque table.",
              "Set the torque wrench to the middle of the range.",
              "Tighten in steps in the sequence shown.",
              "Apply torque seal after the final torque.",
            ],
            limits: [
              ["AN3 bolt, 10-32 nut", "20 to 25 in-lb"],
              ["AN4 bolt, 1/4-28 nut", "50 to 70 in-lb"],
              ["AN5 bolt, 5/16-24 nut", "100 to 140 in-lb"],
            ],
          },
          {
            code: "20-20-00",
            title: "Safety Wiring",
            steps: [
              "Use 0.032 in stainless safety wire unless the drawing says otherwise.",
              "Install the wire so that it pulls the fastener in the tightening direction.",
              "Twist 6 to 8 turns per inch and bend the pigtail back.",
              "Cut the pigtail to 1/4 to 1/2 in.",
            ],
          },
        ],
      },
      {
        ata: "27",
        title: "Flight Controls",
        sections: [
          {
            code: "27-10-00",
            title: "Aileron Cable Tension",
            steps: [
              "Put the control wheel in neutral and install the rigging pin.",
              "Measure the cable tension with a tensiometer at the marked station.",
              "Adjust the turnbuckles equally to bring the tension into limits.",
              "Safety the turnbuckles with clips and remove the rigging pin.",
            ],
            limits: [
              ["Aileron cable tension at 70 F", "30 to 40 lb"],
              ["Aileron travel up", "20 degrees plus or minus 1"],
            ],
          },
          {
            code: "27-20-00",
            title: "Rudder Rigging",
            caution: "Do not use the rudder stops to hold the rudder while you adjust the cables: the stops can bend.",
            steps: [
              "Center the rudder pedals and clamp them.",
              "Check the rudder travel with a protractor.",
              "Adjust the stops and the cable tension together.",
            ],
            limits: [["Rudder travel, each side", "24 degrees plus or minus 1"]],
          },
        ],
      },
      {
        ata: "32",
        title: "Landing Gear",
        sections: [
          {
            code: "32-10-00",
            title: "Main Landing Gear - Inspection",
            warning: jackWarning,
            steps: [
              "Jack the aircraft until the main wheels are clear of the floor.",
              "Check the gear leg for cracks at the attach fittings with a 10x glass.",
              "Check the axle nut torque and the cotter pin. Never back a torqued nut off to line up the cotter-pin hole.",
              "Spin each wheel and listen for bearing noise.",
            ],
            limits: [
              ["Axle nut torque", "150 to 180 in-lb; line up the next slot inside the range, never back the nut off"],
              ["Wheel bearing play", "none felt"],
            ],
          },
          {
            code: "32-40-00",
            title: "Wheels and Brakes",
            steps: [
              "Measure the brake lining thickness at the thinnest point.",
              "Replace both linings of a wheel when one reaches the limit.",
              "Bleed the brakes from the bottom up after any line is opened.",
            ],
            limits: [
              ["Minimum brake lining thickness", "0.100 in"],
              ["Brake disc minimum thickness", "0.205 in"],
            ],
          },
        ],
      },
      {
        ata: "61",
        title: "Propellers",
        sections: [
          {
            code: "61-10-00",
            title: "Propeller Inspection",
            warning: engineWarning,
            steps: [
              "Check each blade for nicks, cracks and erosion along the leading edge.",
              "Measure a nick and compare it with the dressing limits.",
              "Check the spinner and bulkhead for cracks.",
              "Check the propeller bolt torque and the safety wire.",
            ],
            limits: [
              ["Nick dressing, leading edge", "up to 0.060 in deep"],
              ["Propeller bolt torque", "55 to 60 ft-lb"],
            ],
          },
          {
            code: "61-20-00",
            title: "Propeller Track",
            steps: [
              "Block the aircraft so that it cannot move.",
              "Place a fixed pointer within 1/4 in of the blade tip.",
              "Turn the propeller by hand and measure each tip against the pointer.",
            ],
            limits: [["Track difference between blades", "1/16 in maximum"]],
          },
        ],
      },
      {
        ata: "71",
        title: "Power Plant",
        sections: [
          {
            code: "71-00-00",
            title: "Engine Run-Up",
            warning:
              "Keep everyone clear of the propeller arc and behind the wing while the engine runs. A person in the arc will be killed.",
            steps: [
              "Chock the wheels and set the parking brake.",
              "Start the engine and warm up at 1000 rpm until oil temperature rises.",
              "Check each magneto at 1800 rpm and note the drop.",
              "Check idle rpm and mixture cut-off.",
            ],
            limits: [
              ["Magneto drop at 1800 rpm", "125 rpm maximum"],
              ["Difference between magnetos", "50 rpm maximum"],
            ],
          },
          {
            code: "71-20-00",
            title: "Engine Mount",
            steps: [
              "Check the mount tubes for cracks at the welded clusters.",
              "Check the rubber isolators for cracking and oil damage.",
              "Check the mount bolt torque.",
            ],
            limits: [["Engine mount bolt torque", "450 to 500 in-lb"]],
          },
        ],
      },
      {
        ata: "74",
        title: "Ignition",
        sections: [
          {
            code: "74-10-00",
            title: "Magneto Timing to Engine",
            warning: engineWarning,
            note: "Time the left magneto first, then the right, with the timing light on both.",
            steps: [
              "Turn the crankshaft to the number one cylinder compression stroke.",
              "Set the crankshaft to the firing position on the timing marks.",
              "Install the magneto with its timing mark aligned.",
              "Turn the magneto until the breaker points just open and tighten the clamps.",
              "Check the timing again: turn the crankshaft opposite to its rotation well back from the mark, then forward in the direction of rotation only until the points open. If you pass the mark, go back well past it and come forward again: gear backlash makes a reading taken while turning backward wrong.",
            ],
            limits: [["Ignition timing", "25 degrees BTC, plus or minus 1"]],
          },
          {
            code: "74-20-00",
            title: "Spark Plugs",
            caution: "Never use a dropped spark plug: the ceramic insulator can crack inside.",
            steps: [
              "Remove the plugs and put them in a tray in cylinder order.",
              "Read the firing end of each plug for the condition of its cylinder.",
              "Gap the electrodes with a round wire gauge.",
              "Install with anti-seize on the threads and torque.",
            ],
            limits: [
              ["Spark plug gap", "0.016 to 0.021 in"],
              ["Spark plug torque", "300 to 360 in-lb"],
            ],
          },
        ],
      },
      {
        ata: "80",
        title: "Starting",
        sections: [
          {
            code: "80-10-00",
            title: "Starter",
            steps: [
              "Check the starter cable for chafing and a tight terminal.",
              "Check the starter drive for free movement.",
              "Run the starter no longer than 10 seconds, then let it cool.",
            ],
            limits: [["Starter duty cycle", "10 s on, 20 s off, 3 times, then 30 min"]],
          },
        ],
      },
    ],
  },
  {
    title: "SM-4 Magneto Overhaul Manual",
    documentType: "overhaul_manual",
    applicability: ["SM-4", "SM-4R"],
    publisher: "Sparrowline Ignition (invented)",
    chapters: [
      {
        ata: "74",
        title: "Magneto Overhaul",
        sections: [
          {
            code: "74-00-01",
            title: "Disassembly",
            caution: "Keep the rotating magnet against a keeper bar when it is out of the housing, or it loses strength.",
            steps: [
              "Remove the distributor block and the distributor gear.",
              "Remove the breaker assembly and the condenser.",
              "Press out the rotor with the puller.",
              "Tag each part and put it in the parts tray.",
            ],
          },
          {
            code: "74-00-02",
            title: "Cleaning and Inspection",
            steps: [
              "Clean metal parts in solvent and dry with filtered air.",
              "Inspect the distributor block for carbon tracks and cracks.",
              "Measure the rotor shaft bearing journals.",
              "Test the coil with the coil tester.",
            ],
            limits: [
              ["Rotor end play", "0.002 to 0.006 in"],
              ["Coil primary resistance", "0.6 to 0.9 ohm"],
            ],
          },
          {
            code: "74-00-03",
            title: "Assembly and Internal Timing",
            note: "The E-gap is the rotor position past neutral at which the points open.",
            steps: [
              "Install the rotor with new bearings.",
              "Install the breaker assembly loosely.",
              "Set the rotor at the E-gap with the timing kit.",
              "Adjust the breaker so the points just open and tighten.",
            ],
            limits: [
              ["E-gap", "10 degrees plus or minus 4"],
              ["Breaker point gap", "0.016 in plus or minus 0.002"],
            ],
          },
          {
            code: "74-00-04",
            title: "Bench Test",
            warning: "The test bench makes high voltage. Do not touch the leads while the magneto turns.",
            steps: [
              "Mount the magneto on the test bench.",
              "Run it at the test speed and watch the spark gaps.",
              "Check that each lead fires in order with no misses for 5 minutes.",
            ],
            limits: [["Coming-in speed", "150 rpm maximum"]],
          },
        ],
      },
      {
        ata: "05",
        title: "Overhaul Limits",
        sections: [
          {
            code: "05-74-00",
            title: "Table of Limits",
            steps: ["Compare each measured value with this table.", "Replace a part that is outside its limit."],
            limits: [
              ["Cam follower wear", "0.005 in maximum"],
              ["Distributor gear backlash", "0.004 to 0.012 in"],
              ["Housing bore wear", "0.001 in maximum"],
            ],
          },
        ],
      },
    ],
  },
  {
    title: "Fernhollow Sheet-Metal Standard Practices",
    documentType: "handbook",
    applicability: ["HT-20", "Shop practice panel"],
    publisher: "Fernhollow Technical College (invented)",
    chapters: [
      {
        ata: "51",
        title: "Structures - Standard Practices",
        sections: [
          {
            code: "51-10-00",
            title: "Rivet Selection",
            note: "Shop practice: choose the rivet diameter at about three times the thickness of the thickest sheet.",
            steps: [
              "Measure the thickest sheet with a micrometer.",
              "Choose the rivet diameter and material from the table.",
              "Find the grip and add 1.5 diameters for the length.",
            ],
            limits: [
              ["Minimum edge distance", "2 D"],
              ["Maximum edge distance", "4 D"],
              ["Minimum rivet pitch", "3 D"],
              ["Transverse pitch", "75 percent of pitch, never under 2.5 D"],
              ["Rivet length", "grip plus 1.5 D, next standard length up"],
            ],
          },
          {
            code: "51-20-00",
            title: "Drilling and Deburring",
            caution: "Hold the drill square to the work; an oval hole weakens the joint.",
            steps: [
              "Center punch each rivet location lightly.",
              "Drill a pilot hole, then ream to size.",
              "Deburr both sides with a deburring tool, not a larger drill.",
            ],
            limits: [
              ["Hole for 1/8 in rivet", "No. 30 drill"],
              ["Hole for 5/32 in rivet", "No. 21 drill"],
            ],
          },
          {
            code: "51-30-00",
            title: "Rivet Installation",
            warning: "Wear hearing and eye protection when you use a rivet gun.",
            steps: [
              "Clamp the sheets with cleco fasteners every fourth hole.",
              "Hold the bucking bar square to the rivet shank.",
              "Drive the rivet in short bursts until the shop head is formed.",
              "Check the shop head diameter and height with a rivet gauge.",
            ],
            limits: [
              ["Shop head diameter", "1.5 D; 1/8 in rivet 0.180 to 0.200 in"],
              ["Shop head height", "0.5 D; 1/8 in rivet 0.055 to 0.070 in"],
            ],
          },
          {
            code: "51-40-00",
            title: "Bending Sheet Metal",
            steps: [
              "Find the minimum bend radius for the alloy and thickness.",
              "Compute the setback and the bend allowance.",
              "Lay out the flat pattern and mark the bend lines.",
              "Bend on the brake with the sight line on the radius bar.",
            ],
            limits: [["Minimum radius, 0.040 in 2024-T3", "0.16 in"]],
          },
          {
            code: "51-50-00",
            title: "Repair of Skin Damage",
            steps: [
              "Trim the damage to a smooth round or oval hole.",
              "Make a doubler of the same alloy one gauge thicker.",
              "Lay out two rows of rivets around the hole.",
              "Install the doubler and the filler and rivet.",
            ],
          },
        ],
      },
      {
        ata: "20",
        title: "Corrosion Control",
        sections: [
          {
            code: "20-40-00",
            title: "Corrosion Removal",
            warning: chemicalWarning,
            steps: [
              "Clean the area and find the extent of the corrosion.",
              "Remove light corrosion with a nonwoven abrasive pad.",
              "Measure the depth of the blend with a depth gauge.",
              "Apply conversion coating and primer.",
            ],
            limits: [["Maximum blend depth, skin", "10 percent of thickness"]],
          },
        ],
      },
    ],
  },
  {
    title: "Penetrant Inspection Procedure FTC-NDT-02",
    documentType: "school_procedure",
    applicability: ["HT-20", "TF-400", "SM-4"],
    publisher: "Fernhollow Technical College NDT Room (invented)",
    chapters: [
      {
        ata: "51",
        title: "Nondestructive Testing - Liquid Penetrant",
        sections: [
          {
            code: "51-61-01",
            title: "Preparation and Precleaning",
            warning: chemicalWarning,
            caution: "Never sand, blast or scrape paint off before the test: smeared metal closes the cracks the test must find.",
            steps: [
              "Remove paint and coatings from the area to be inspected with chemical stripper.",
              "Clean with solvent and let the part dry completely.",
              "Check that the part temperature is inside the limits.",
            ],
            limits: [["Part temperature", `${penetrantWindowF.min} to ${penetrantWindowF.max} F`]],
          },
          {
            code: "51-61-02",
            title: "Penetrant Application and Dwell",
            steps: [
              "Apply fluorescent penetrant by brush or spray to cover the area.",
              "Start the dwell timer.",
              "Keep the surface wet during the dwell.",
            ],
            limits: [["Penetrant dwell time", "10 minutes minimum, 60 maximum"]],
            note: "Dwell times are those of this school procedure; the penetrant maker's data and the part's manual come first.",
          },
          {
            code: "51-61-03",
            title: "Removal and Developer",
            caution: "Do not spray remover straight onto the part: it washes penetrant out of the flaws.",
            steps: [
              "Wipe off the excess penetrant with a dry lint-free cloth.",
              "Wipe with a cloth dampened with remover.",
              "Apply a thin even coat of nonaqueous developer.",
              "Start the development timer.",
            ],
            limits: [["Development time", "half the dwell, 10 minutes minimum, inspect within 30 minutes after the developer dries"]],
          },
          {
            code: "51-61-04",
            title: "Inspection Under UV-A Light",
            warning: uvWarning,
            steps: [
              "Let your eyes adapt to the dark booth for at least 1 minute.",
              "Check the UV-A intensity at the part surface with the meter.",
              "Inspect for bright lines and dots.",
              "Mark each indication and record it on the process record.",
            ],
            limits: [
              ["UV-A intensity at the surface", "1000 microwatts per square cm minimum"],
              ["Ambient white light in booth", "2 foot-candles maximum"],
            ],
          },
        ],
      },
      {
        ata: "05",
        title: "Records",
        sections: [
          {
            code: "05-61-00",
            title: "Process Record",
            steps: ["Fill in the process record for every part.", "Give the record to the instructor for sign-off."],
          },
        ],
      },
    ],
    scannedPage: {
      afterSection: "05-61-00",
      lines: [
        "APPENDIX A - PENETRANT PROCESS RECORD (SCANNED FORM)",
        "Part name and number",
        "Penetrant batch number",
        "Dwell time started at",
        "Development time started at",
        "Indications found and their location",
        "Student initials and instructor initials",
      ],
    },
  },
  {
    title: "TF-400 Engine Removal and Installation",
    documentType: "maintenance_manual",
    applicability: ["TF-400"],
    publisher: "Taleva Turbine Company (invented)",
    chapters: [
      {
        ata: "71",
        title: "Power Plant - Removal and Installation",
        sections: [
          {
            code: "71-00-10",
            title: "Engine Removal - Preparation",
            warning:
              "Drain the fuel lines into an approved container and keep fire extinguishers at the work area. The ignition exciter stores a lethal charge: open its circuit breaker and wait 5 minutes before you touch an igniter lead.",
            caution:
              "Install the tail stand before the engine comes off: without the engine's weight the centre of gravity moves aft and the aircraft can sit on its tail.",
            steps: [
              "Install the tail stand.",
              "Disconnect the battery, open the circuit breakers and tag them.",
              "Close the fuel shutoff valve and drain the lines.",
              "Tag and disconnect the electrical connectors, then cap them.",
              "Cap every open line and fitting.",
            ],
          },
          {
            code: "71-00-20",
            title: "Engine Removal - Hoisting",
            warning: "Never stand under a raised engine. A dropped engine crushes.",
            caution: "Take up the weight with the hoist before the first mount bolt comes out, or the mounts bend.",
            steps: [
              "Attach the lifting sling to the engine hoist points.",
              "Take up the weight with the hoist.",
              "Remove the mount bolts in the order shown.",
              "Lower the engine onto the transport stand and secure it.",
            ],
            limits: [["Engine dry weight", "310 lb"]],
          },
          {
            code: "71-00-30",
            title: "Engine Installation",
            steps: [
              "Hoist the engine into position on the mounts.",
              "Install the mount bolts and torque them in sequence. Never back a torqued nut off, or go past the maximum, to line up a cotter-pin hole.",
              "Connect the lines and connectors, removing each cap as you go.",
              "Close the circuit breakers, then do a leak check and a ground run.",
            ],
            limits: [["Mount bolt torque", "40 to 45 ft-lb"]],
          },
        ],
      },
      {
        ata: "72",
        title: "Engine - Inspection",
        sections: [
          {
            code: "72-00-10",
            title: "Borescope Inspection",
            caution: "Turn the compressor only by hand in the direction of rotation.",
            steps: [
              "Remove the borescope port plug.",
              "Insert the probe and inspect each compressor blade.",
              "Record damage with the borescope camera.",
            ],
            limits: [["Leading edge nick, first stage", "0.015 in maximum"]],
          },
          {
            code: "72-00-20",
            title: "Compressor Wash",
            steps: [
              "Mix the wash fluid at the ratio on the container.",
              "Motor the engine with the starter and spray the wash into the inlet.",
              "Rinse with water and dry by motoring.",
            ],
          },
        ],
      },
      {
        ata: "80",
        title: "Starting System",
        sections: [
          {
            code: "80-00-10",
            title: "Starter-Generator",
            steps: [
              "Check the mounting clamp and its torque.",
              "Check the brushes for length through the inspection window.",
              "Check the cooling air duct for cracks.",
            ],
            limits: [["Minimum brush length", "0.5 in"]],
          },
        ],
      },
    ],
  },
];

/**
 * The second revision of the HT-20 manual, with known changes against the first:
 *  - 32-10-00: the axle nut torque changes (a changed page),
 *  - 12-40-00: a new section on hydraulic brake fluid servicing (pages added in the middle),
 *  - 61-20-00: the propeller track section is withdrawn (pages removed),
 * and every page carries the new revision label (which alone is no change).
 */
export function secondRevisionOfTrainer(first: DemoManual): DemoManual {
  const copy: DemoManual = structuredClone(first);
  for (const chapter of copy.chapters) {
    for (const section of chapter.sections) {
      if (section.code === "32-10-00" && section.limits) {
        section.limits = section.limits.map(([k, v]) =>
          k === "Axle nut torque" ? [k, "120 to 150 in-lb; line up the next slot inside the range, never back the nut off"] : [k, v],
        );
      }
    }
    if (chapter.ata === "12") {
      chapter.sections.push({
        code: "12-40-00",
        title: "Brake Fluid Servicing",
        caution: "Use only the hydraulic fluid named on the reservoir. Mixed fluids ruin the seals.",
        steps: [
          "Clean the reservoir cap before you open it.",
          "Fill the reservoir to the full line with the approved fluid.",
          "Bleed the brakes if the pedal feels soft.",
        ],
        limits: [["Brake fluid", "MIL-PRF-5606 type, red"]],
      });
    }
    if (chapter.ata === "61") chapter.sections = chapter.sections.filter((s) => s.code !== "61-20-00");
  }
  return copy;
}

export const demoRevisions = {
  trainerFirst: { label: "Rev 3", date: "2025-06-01" },
  trainerSecond: { label: "Rev 4", date: "2026-03-15" },
  others: { label: "Rev 1", date: "2025-01-15" },
} as const;
