import { describe, expect, it } from "vitest";
import { compareSteps } from "@/lib/domain/runs/move";
import type { Step } from "@/lib/domain/validation/cards";
import { cannotMarkDone, foldRun, orderEvents, reopenedStepIds, type CardStepForRun, type RunEvent } from "@/lib/domain/runs/fold";

const steps: CardStepForRun[] = [
  { id: "s1", inspectionPoint: false, measurement: { unit: "in-lb", min: 50, max: 70 }, timerMinutes: null },
  { id: "s2", inspectionPoint: true, measurement: null, timerMinutes: 10 },
  { id: "s3", inspectionPoint: false, measurement: null, timerMinutes: null },
];
const student = "student-1";
const instructor = "instructor-1";
const instructors = new Set([instructor]);
let n = 0;
const at = (minute: number) => `2026-12-01T10:${String(minute).padStart(2, "0")}:00.000Z`;
const ev = (type: RunEvent["type"], minute: number, extra: Partial<RunEvent> = {}): RunEvent => ({
  id: `e${String(++n).padStart(3, "0")}`,
  type,
  userId: student,
  clientTime: at(minute),
  ...extra,
});

const story: RunEvent[] = [
  ev("value.recorded", 1, { stepId: "s1", payload: { value: "80 in-lb" } }),
  ev("value.recorded", 2, { stepId: "s1", payload: { value: "6.5 N·m" } }), // 57.5 in-lb: the later reading wins
  ev("step.checked", 3, { stepId: "s1" }),
  ev("note.added", 4, { stepId: "s1", payload: { text: "Re-torqued after the first reading." } }),
  ev("timer.started", 5, { stepId: "s2", payload: { minutes: 10 } }),
  ev("timer.stopped", 15, { stepId: "s2" }),
  ev("step.checked", 16, { stepId: "s2" }),
  ev("inspection.bought_off", 20, { stepId: "s2", userId: instructor }),
  ev("step.checked", 21, { stepId: "s3" }),
  ev("run.submitted", 22),
];

function shuffled<T>(list: T[], seed: number): T[] {
  const out = [...list];
  let x = seed;
  for (let i = out.length - 1; i > 0; i--) {
    x = (x * 1103515245 + 12345) % 2 ** 31;
    const j = x % (i + 1);
    [out[i], out[j]] = [out[j]!, out[i]!];
  }
  return out;
}

describe("run event fold", () => {
  it("derives the run from its events", () => {
    const state = foldRun(story, steps, instructors);
    expect(state.status).toBe("submitted");
    expect(state.steps.s1!.value?.judgement).toMatchObject({ status: "in" });
    expect(state.steps.s1!.notes).toHaveLength(1);
    expect(state.steps.s2!.timer).toEqual({ startedAt: at(5), minutes: 10, stoppedAt: at(15) });
    expect(state.steps.s2!.boughtOff).toEqual({ by: instructor, at: at(20) });
    expect(state.waitingAt).toBeNull();
    expect(state.ignored).toEqual([]);
  });

  it("gives the same state whatever order the events arrive in", () => {
    const expected = foldRun(story, steps, instructors);
    for (let seed = 1; seed <= 50; seed++) expect(foldRun(shuffled(story, seed), steps, instructors)).toEqual(expected);
  });

  it("counts an event sent twice once", () => {
    const twice = [...story, ...story.slice(3, 5), story[3]!];
    expect(foldRun(twice, steps, instructors)).toEqual(foldRun(story, steps, instructors));
    expect(orderEvents(twice)).toHaveLength(story.length);
  });

  it("sets aside every event after the sign-off", () => {
    const signOff = ev("run.signed_off", 30, { userId: instructor });
    const late = ev("step.unchecked", 31, { stepId: "s3" });
    const state = foldRun([...story, late, signOff], steps, instructors);
    expect(state.status).toBe("signed_off");
    expect(state.steps.s3!.checked).toBe(true);
    expect(state.ignored).toEqual([{ id: late.id, reason: "after sign-off" }]);
  });

  it("lets only an instructor buy off, return or sign off", () => {
    const state = foldRun(
      [ev("step.checked", 1, { stepId: "s2" }), ev("inspection.bought_off", 2, { stepId: "s2" }), ev("run.signed_off", 3)],
      steps,
      instructors,
    );
    expect(state.steps.s2!.boughtOff).toBeNull();
    expect(state.signedOff).toBeNull();
    expect(state.waitingAt).toBe("s2");
    expect(state.ignored.map((i) => i.reason)).toEqual(["only an instructor may buy off", "only an instructor may do this"]);
  });

  it("judges an out-of-limits value, and a return sends the run back to work", () => {
    const state = foldRun(
      [
        ev("value.recorded", 1, { stepId: "s1", payload: { value: "90" } }),
        ev("run.submitted", 2),
        ev("run.returned", 3, { userId: instructor, payload: { comment: "Torque is high: redo step 1." } }),
      ],
      steps,
      instructors,
    );
    expect(state.steps.s1!.value?.judgement.status).toBe("out");
    expect(state.status).toBe("returned");
    expect(state.returnedComment).toBe("Torque is high: redo step 1.");
    const resumed = foldRun(
      [...story.slice(0, 1), ev("run.returned", 3, { userId: instructor }), ev("step.checked", 4, { stepId: "s1" })],
      steps,
      instructors,
    );
    expect(resumed.status).toBe("in_progress");
  });

  it("ignores events for steps the card version does not have", () => {
    const state = foldRun([ev("step.checked", 1, { stepId: "nope" })], steps, instructors);
    expect(state.ignored).toEqual([expect.objectContaining({ reason: "no such step on this card version" })]);
    expect(state.status).toBe("not_started");
  });
});

describe("what the instructor saw stays", () => {
  it("ignores the student's changes to a bought-off step, except notes", () => {
    const later = [
      ...story.slice(0, 8),
      ev("step.unchecked", 30, { stepId: "s2" }),
      ev("timer.started", 31, { stepId: "s2" }),
      ev("note.added", 32, { stepId: "s2", payload: { text: "Safety wire photo added." } }),
    ];
    const state = foldRun(later, steps, instructors);
    expect(state.steps.s2!.checked).toBe(true);
    expect(state.steps.s2!.timer!.stoppedAt).toBe(at(15));
    expect(state.steps.s2!.notes.map((x) => x.text)).toEqual(["Safety wire photo added."]);
    expect(state.ignored.map((i) => i.reason)).toEqual(["this inspection point is bought off", "this inspection point is bought off"]);
  });

  it("ignores step changes after handing in until the run is returned", () => {
    const handedIn = [
      ...story,
      ev("value.recorded", 40, { stepId: "s1", payload: { value: "90 in-lb" } }),
      ev("run.returned", 45, { userId: instructor, payload: { comment: "Check s1 again" } }),
      ev("value.recorded", 50, { stepId: "s1", payload: { value: "60 in-lb" } }),
    ];
    const state = foldRun(handedIn, steps, instructors);
    expect(state.ignored).toEqual([{ id: handedIn.at(-3)!.id, reason: "handed in: wait for the instructor" }]);
    expect(state.steps.s1!.value!.text).toBe("60 in-lb");
    expect(state.status).toBe("in_progress");
  });
});

describe("a cart's clock cannot bend what was reviewed", () => {
  // Receipt times are the server's; `at(m)` is minute m on both clocks.
  const got = (e: RunEvent, minute: number): RunEvent => ({ ...e, serverTime: at(minute) });
  const live = (list: RunEvent[]) => list.map((e) => got(e, Number(e.clientTime.slice(14, 16))));

  it("keeps a bought-off value when a back-dated change arrives after the buy-off", () => {
    const s1ip: CardStepForRun[] = [{ ...steps[0]!, inspectionPoint: true }, steps[2]!];
    const before = live([
      ev("value.recorded", 1, { stepId: "s1", payload: { value: "60 in-lb" } }),
      ev("step.checked", 2, { stepId: "s1" }),
      ev("inspection.bought_off", 5, { stepId: "s1", userId: instructor }),
    ]);
    const sneaked = got(ev("value.recorded", 3, { stepId: "s1", payload: { value: "95 in-lb" } }), 8); // stamped before the buy-off, sent after it
    const state = foldRun([...before, sneaked], s1ip, instructors);
    expect(state.steps.s1!.value!.text).toBe("60 in-lb");
    expect(state.steps.s1!.value!.judgement.status).toBe("in");
    expect(state.late).toEqual([{ id: sneaked.id, after: "buy-off", at: at(5) }]);
    expect(state.ignored).toEqual([{ id: sneaked.id, reason: "arrived after the buy-off: this inspection point is bought off" }]);
  });

  it("keeps a handed-in run as handed in when a back-dated change arrives after the hand-in", () => {
    const handedIn = live([
      ev("value.recorded", 1, { stepId: "s1", payload: { value: "60 in-lb" } }),
      ev("step.checked", 2, { stepId: "s1" }),
      ev("run.submitted", 3),
    ]);
    const sneaked = got(ev("value.recorded", 2, { stepId: "s1", payload: { value: "40 in-lb" } }), 9);
    const state = foldRun([...handedIn, sneaked], steps, instructors);
    expect(state.status).toBe("submitted");
    expect(state.steps.s1!.value!.text).toBe("60 in-lb");
    expect(state.ignored.map((i) => i.reason)).toEqual(["arrived after the hand-in: handed in: wait for the instructor"]);
  });

  it("changes nothing after a sign-off, whatever the stamp", () => {
    const signed = live([
      ...story.slice(0, 7),
      ev("run.submitted", 17),
      ev("inspection.bought_off", 18, { stepId: "s2", userId: instructor }),
      ev("run.signed_off", 25, { userId: instructor }),
    ]);
    const sneaked = got(ev("step.unchecked", 4, { stepId: "s1" }), 40);
    const state = foldRun([...signed, sneaked], steps, instructors);
    expect(state.status).toBe("signed_off");
    expect(state.steps.s1!.checked).toBe(true);
    expect(state.ignored.at(-1)!.reason).toBe("arrived after the sign-off: after sign-off");
  });

  it("places a review after everything received before it, even a cart stamp from the future", () => {
    const fast = got(ev("step.checked", 50, { stepId: "s3" }), 10); // the cart's clock runs 40 minutes fast
    const returned = got(ev("run.returned", 11, { userId: instructor, payload: { comment: "Redo" } }), 11);
    const order = orderEvents([returned, got(ev("run.submitted", 51), 10), fast]).map((o) => o.event.type);
    expect(order).toEqual(["step.checked", "run.submitted", "run.returned"]);
  });

  it("folds an honest offline session sent late exactly as if it had been sent live", () => {
    const work = story.filter((e) => e.type !== "inspection.bought_off" && e.type !== "run.submitted");
    const asLive = foldRun(live(work), steps, instructors);
    const allAtOnce = foldRun(
      work.map((e) => got(e, 59)),
      steps,
      instructors,
    ); // one batch an hour later
    const inTwoLateBatches = foldRun(
      work.map((e, i) => got(e, i < 3 ? 40 : 45)),
      steps,
      instructors,
    );
    for (const s of [allAtOnce, inTwoLateBatches]) {
      expect(s.steps).toEqual(asLive.steps);
      expect(s.status).toBe(asLive.status);
      expect(s.ignored).toEqual([]);
    }
    // Work offline while the instructor bought off another step: it still counts.
    const boughtOff = live([ev("step.checked", 1, { stepId: "s2" }), ev("inspection.bought_off", 2, { stepId: "s2", userId: instructor })]);
    const offline = got(ev("value.recorded", 1, { stepId: "s1", payload: { value: "61 in-lb" } }), 9);
    const state = foldRun([...boughtOff, offline], steps, instructors);
    expect(state.steps.s1!.value!.text).toBe("61 in-lb");
    expect(state.ignored).toEqual([]);
    expect(state.late).toEqual([{ id: offline.id, after: "buy-off", at: at(2) }]);
  });

  it("does not hand a returned run in again with a hand-in made before the return", () => {
    const returned = live([
      ev("step.checked", 1, { stepId: "s1" }),
      ev("run.submitted", 2),
      ev("run.returned", 5, { userId: instructor, payload: { comment: "Redo" } }),
    ]);
    const oldHandIn = got(ev("run.submitted", 3), 9); // a second cart's, offline, sent after the return
    const state = foldRun([...returned, oldHandIn], steps, instructors);
    expect(state.status).toBe("returned");
    expect(state.ignored.map((i) => i.reason)).toEqual(["arrived after the return: handed in before the return"]);
  });

  it("does not call honest work late because one fast stamp pushed a review ahead", () => {
    const fast = got(ev("step.checked", 50, { stepId: "s1" }), 2); // this cart's clock ran 48 minutes fast once
    const boughtOff = got(ev("inspection.bought_off", 3, { stepId: "s2", userId: instructor }), 3);
    const honest = got(ev("step.checked", 4, { stepId: "s3" }), 4);
    const state = foldRun([fast, got(ev("step.checked", 2, { stepId: "s2" }), 2), boughtOff, honest], steps, instructors);
    expect(state.late).toEqual([]);
    expect(state.steps.s3!.checked).toBe(true);
  });

  it("gives the same state for any listing order of the same received events (property)", () => {
    let x = 7;
    const rand = (k: number) => ((x = (x * 1103515245 + 12345) % 2 ** 31), x % k);
    const types = [
      "step.checked",
      "step.unchecked",
      "value.recorded",
      "note.added",
      "run.submitted",
      "inspection.bought_off",
      "run.returned",
      "run.signed_off",
    ] as const;
    for (let trial = 0; trial < 200; trial++) {
      const list: RunEvent[] = [];
      for (let i = 0, count = 3 + rand(12); i < count; i++) {
        const type = types[rand(types.length)]!;
        const reviewer = type === "inspection.bought_off" || type === "run.returned" || type === "run.signed_off";
        list.push(
          got(
            ev(type, rand(50), {
              userId: reviewer ? instructor : student,
              stepId: type.startsWith("run.") ? null : ["s1", "s2", "s3"][rand(3)]!,
              payload: { value: `${50 + rand(30)} in-lb`, text: "n" },
            }),
            rand(8) * 7, // a handful of batches
          ),
        );
      }
      const expected = foldRun(list, steps, instructors);
      for (let seed = 1; seed <= 5; seed++) expect(foldRun(shuffled(list, seed + trial), steps, instructors)).toEqual(expected);
      expect(foldRun([...list, ...list.slice(0, 2)], steps, instructors)).toEqual(expected);
    }
  });
});

describe("readings, rework and calls for a buy-off", () => {
  it("keeps every reading of a step, and an out-of-limit one needs a note before the step is done", () => {
    const refused = foldRun(
      [ev("value.recorded", 1, { stepId: "s1", payload: { value: "80 in-lb" } }), ev("step.checked", 2, { stepId: "s1" })],
      steps,
      instructors,
    );
    expect(refused.steps.s1!.checked).toBe(false);
    expect(refused.ignored[0]!.reason).toMatch(/out of limits: write a note/);
    expect(cannotMarkDone(steps[0]!, refused.steps.s1!)).toMatch(/out of limits/);

    const noted = foldRun(
      [
        ev("value.recorded", 1, { stepId: "s1", payload: { value: "80 in-lb" } }),
        ev("note.added", 2, { stepId: "s1", payload: { text: "Wrench read high; reported to the instructor." } }),
        ev("step.checked", 3, { stepId: "s1" }),
        ev("value.recorded", 4, { stepId: "s1", payload: { value: "60 in-lb" } }),
      ],
      steps,
      instructors,
    );
    expect(noted.steps.s1!.checked).toBe(true);
    expect(noted.steps.s1!.checkedBy).toBe(student);
    expect(noted.steps.s1!.readings.map((r) => [r.text, r.judgement.status])).toEqual([
      ["80 in-lb", "out"],
      ["60 in-lb", "in"],
    ]);
    expect(noted.steps.s1!.value?.text).toBe("60 in-lb");
  });

  it("reopens the steps the instructor names on a return, bought-off ones included, and keeps the earlier readings", () => {
    const state = foldRun(
      [
        ...story,
        ev("run.returned", 23, { userId: instructor, payload: { comment: "Redo the torque and the wire.", reopenStepIds: ["s1", "s2"] } }),
      ],
      steps,
      instructors,
    );
    expect(state.status).toBe("returned");
    expect(state.steps.s1).toMatchObject({ checked: false, value: null, reopened: { at: at(23), by: instructor } });
    expect(state.steps.s1!.readings).toHaveLength(2);
    expect(state.steps.s2).toMatchObject({ checked: false, boughtOff: null, reopened: { by: instructor } });
    expect(state.steps.s3).toMatchObject({ checked: true, reopened: null });
    // The reopened inspection point takes work again and waits for a new buy-off.
    const again = foldRun(
      [
        ...story,
        ev("run.returned", 23, { userId: instructor, payload: { reopenStepIds: ["s2"] } }),
        ev("step.checked", 24, { stepId: "s2" }),
        ev("inspection.called", 25, { stepId: "s2" }),
      ],
      steps,
      instructors,
    );
    expect(again.waitingAt).toBe("s2");
    expect(again.calledAt).toBe(at(25));
    expect(reopenedStepIds({ reopenStepIds: ["s1", 7, null] })).toEqual(["s1"]);
  });

  it("takes a call for the instructor only at a done inspection point, and forgets it when the step is undone", () => {
    const early = foldRun([ev("inspection.called", 1, { stepId: "s2" })], steps, instructors);
    expect(early.calledAt).toBeNull();
    expect(early.ignored[0]!.reason).toMatch(/once the step is done/);
    expect(
      foldRun([ev("step.checked", 1, { stepId: "s3" }), ev("inspection.called", 2, { stepId: "s3" })], steps, instructors).ignored[0]!
        .reason,
    ).toBe("not an inspection point");
    const called = [ev("step.checked", 1, { stepId: "s2" }), ev("inspection.called", 2, { stepId: "s2" })];
    expect(foldRun(called, steps, instructors)).toMatchObject({ waitingAt: "s2", calledAt: at(2) });
    const undone = foldRun([...called, ev("step.unchecked", 3, { stepId: "s2" })], steps, instructors);
    expect(undone).toMatchObject({ waitingAt: null, calledAt: null });
  });
});

describe("a move to a new card version", () => {
  it("restarts the steps that changed, keeps the rest, and opens a handed-in run again", () => {
    const state = foldRun(
      [...story, ev("run.moved", 30, { userId: instructor, payload: { fromVersion: 1, toVersion: 2, reopenStepIds: ["s1"] } })],
      steps,
      instructors,
    );
    expect(state.status).toBe("in_progress");
    // The old readings were judged against the old limits: not carried, and not judged again.
    expect(state.steps.s1).toMatchObject({ checked: false, value: null, readings: [], reopened: { why: "new version" } });
    expect(state.steps.s3!.checked).toBe(true);
    expect(state.ignored).toEqual([]);
    const fromStudent = foldRun([ev("run.moved", 1, { payload: { reopenStepIds: ["s1"] } })], steps, instructors);
    expect(fromStudent.ignored[0]!.reason).toBe("only an instructor may do this");
  });

  it("does not count offline work on a changed step that was done before the move and sent after it", () => {
    const moved = { ...ev("run.moved", 10, { userId: instructor, payload: { reopenStepIds: ["s3"] } }), serverTime: at(10) };
    const late = { ...ev("step.checked", 5, { stepId: "s3" }), serverTime: at(12) };
    const kept = { ...ev("step.checked", 6, { stepId: "s1" }), serverTime: at(12) };
    const state = foldRun([moved, late, kept], steps, instructors);
    expect(state.steps.s3!.checked).toBe(false);
    expect(state.ignored.map((i) => i.reason)).toEqual([
      "arrived after the move to a new card version: done on the earlier card version; this step changed in the new one",
    ]);
    expect(state.steps.s1!.checked).toBe(true);
  });
});

describe("comparing card versions for a move", () => {
  const step = (id: string, over: Partial<Step> = {}): Step => ({
    id,
    text: `Do ${id}.`,
    notices: [],
    references: [],
    measurement: null,
    calculator: null,
    inspectionPoint: false,
    calibratedTool: false,
    elements: [],
    timerMinutes: null,
    ...over,
  });
  it("keeps unchanged steps, restarts changed or rechecked ones, and lists added and removed ones", () => {
    const old = [step("a"), step("b"), step("c"), step("d", { references: [{ revisionId: "r1", page: 4, quote: "" }] })];
    const next = [
      step("a"),
      step("b", { measurement: { label: "Gap", unit: "in", min: 0.01, max: 0.02, nominal: null, tolerance: null } }),
      step("d", { references: [{ revisionId: "r2", page: 5, quote: "" }] }),
      step("e"),
    ];
    expect(compareSteps(old, next, new Set())).toEqual({ kept: ["a", "d"], restarted: ["b"], added: ["e"], removed: ["c"] });
    // A cited page whose content changed in a new revision restarts the step even when the card's words did not.
    expect(compareSteps(old, next, new Set(["d"])).restarted).toEqual(["b", "d"]);
  });
});
