"use client";

import { useRouter } from "next/navigation";
import { useCallback, useEffect, useRef, useState } from "react";
import { useFieldArray, useForm } from "react-hook-form";
import { ToolRoomPicker } from "./tool-room-picker";
import { CardView } from "@/components/card-view";
import { ApiError, call } from "@/lib/client/api";
import type { CardDto, CardVersionDto, SubjectDto } from "@/lib/contracts/cards";
import { emptyStep, fromVersion, toContent, toPreview, type CardForm } from "./card-form";
import { writeCitingTarget } from "@/lib/client/citing-target";
import { StepEditor, type ManualOption } from "./step-editor";
import { useSaveDraft } from "./use-cards";
import { cardsApi } from "@/lib/contracts/endpoints/cards";
import { useLeaveGuard } from "@/components/use-leave-guard";

type SaveState =
  { kind: "saved"; at: Date | null } | { kind: "unsaved" } | { kind: "saving" } | { kind: "error"; message: string; conflict: boolean };

const autosaveDelayMs = 1200;

/**
 * The card editor: header fields, steps (add, edit, reorder with buttons or the keyboard, remove),
 * autosave of the draft, and a preview that is the student's own view of the card.
 */
export function CardEditor({
  card,
  subjects,
  manuals,
  userId,
}: {
  card: CardDto;
  subjects: SubjectDto[];
  manuals: ManualOption[];
  userId: string;
}) {
  const router = useRouter();
  const base = (card.draft ?? card.published)!;
  const { control, register, setValue, getValues, subscribe, formState } = useForm<CardForm>({ defaultValues: fromVersion(base) });
  const steps = useFieldArray({ control, name: "steps", keyName: "key" });
  const save = useSaveDraft(card.id);
  const editCount = useRef(base.editCount);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const running = useRef<Promise<boolean> | null>(null);
  const again = useRef(false);
  const [state, setState] = useState<SaveState>({ kind: "saved", at: card.draft ? new Date(card.draft.updatedAt) : null });
  const [versionNumber, setVersionNumber] = useState(card.draft?.number ?? null);
  const [tab, setTab] = useState<"edit" | "preview">("edit");
  const [publishing, setPublishing] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const [publishError, setPublishError] = useState<string | null>(null);
  // What the saved draft still needs before publishing: shown as a list, never a reason to refuse a save.
  const [problems, setProblems] = useState(base.status === "draft" ? base.problems : []);
  const dirty = useRef(false);

  const saveNow = useCallback(async (): Promise<boolean> => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    // One save at a time; a change made while one runs is saved right after it.
    if (running.current) {
      again.current = true;
      return running.current;
    }
    const saveOnce = async () => {
      setState({ kind: "saving" });
      try {
        const version: CardVersionDto = await save.mutateAsync({ content: toContent(getValues()), editCount: editCount.current });
        editCount.current = version.editCount;
        setVersionNumber(version.number);
        setProblems(version.problems);
        setState({ kind: "saved", at: new Date() });
        return true;
      } catch (error) {
        // The field's own words ("Step 1: The minimum is above the maximum."), not its key.
        const reason = error instanceof ApiError ? (Object.values(error.fields)[0] ?? error.message) : "The draft could not be saved.";
        const message = `Not saved: ${reason}`;
        setState({ kind: "error", message, conflict: error instanceof ApiError && error.status === 409 });
        return false;
      }
    };
    const work = (async () => {
      let ok: boolean;
      do {
        again.current = false;
        ok = await saveOnce();
      } while (again.current && ok);
      if (ok) dirty.current = false;
      return ok;
    })();
    running.current = work;
    try {
      return await work;
    } finally {
      running.current = null;
    }
  }, [getValues, save]);

  useEffect(() => {
    return subscribe({
      formState: { values: true },
      callback: () => {
        dirty.current = true;
        setState((s) => (s.kind === "error" && s.conflict ? s : { kind: "unsaved" }));
        if (timer.current) clearTimeout(timer.current);
        timer.current = setTimeout(() => void saveNow(), autosaveDelayMs);
      },
    });
  }, [subscribe, saveNow]);

  // Typing waits up to the autosave delay before it is sent; leaving in that moment, or after a
  // save that failed, asks first.
  useLeaveGuard(() => dirty.current || running.current !== null);

  const citeFromReader = async (stepId: string) => {
    if (!(await saveNow())) return;
    writeCitingTarget(userId, { cardId: card.id, title: getValues("title"), stepId });
    router.push("/library");
  };

  /** Saves, then asks: a published version is what students run, and it never changes. */
  const askToPublish = async () => {
    setPublishError(null);
    if (!(await saveNow())) return;
    setConfirming(true);
  };

  const done = async () => {
    if (dirty.current && !(await saveNow()) && !window.confirm("Your last changes could not be saved. Leave the editor anyway?")) return;
    router.push(`/cards/${card.id}`);
  };

  const publish = async () => {
    setPublishError(null);
    setConfirming(false);
    setPublishing(true);
    try {
      if (!(await saveNow())) return;
      await call(cardsApi.publish, { params: { id: card.id } });
      writeCitingTarget(userId, null);
      router.push(`/cards/${card.id}`);
      router.refresh();
    } catch (error) {
      // Every problem at once, in its own words, so the author fixes them in one pass.
      const reasons = error instanceof ApiError ? Object.values(error.fields) : [];
      setPublishError(reasons.length ? reasons.join(" ") : error instanceof ApiError ? error.message : "The card could not be published.");
    } finally {
      setPublishing(false);
    }
  };

  const todo = (field: string) => {
    const p = problems.find((x) => x.field === field);
    return p ? <span className="field-todo">To finish: {p.message}</span> : null;
  };
  const subjectName = (id: string) => subjects.find((s) => s.id === id)?.name ?? null;
  const status =
    state.kind === "saved"
      ? state.at
        ? `Draft${versionNumber ? ` version ${versionNumber}` : ""} saved at ${state.at.toLocaleTimeString("en-GB", { hour: "2-digit", minute: "2-digit" })}`
        : "No changes yet: the published version stays as it is until you change something."
      : state.kind === "saving"
        ? "Saving…"
        : state.kind === "unsaved"
          ? "Changes not saved yet…"
          : state.message;

  return (
    <div className="flex flex-col gap-5">
      <div className="sticky top-0 z-10 flex flex-wrap items-center gap-3 border-b-2 border-line bg-paper py-2">
        <div role="tablist" aria-label="Editor view" className="flex gap-2">
          <button
            type="button"
            role="tab"
            aria-selected={tab === "edit"}
            className={`btn ${tab === "edit" ? "btn-primary" : "btn-secondary"}`}
            onClick={() => setTab("edit")}
          >
            Edit
          </button>
          <button
            type="button"
            role="tab"
            aria-selected={tab === "preview"}
            className={`btn ${tab === "preview" ? "btn-primary" : "btn-secondary"}`}
            onClick={() => setTab("preview")}
          >
            Preview as a student
          </button>
        </div>
        <p aria-live="polite" className={`mr-auto font-semibold ${state.kind === "error" ? "text-danger" : "text-ink-soft"}`}>
          {status}
          {state.kind === "error" && state.conflict ? (
            <button type="button" className="btn btn-secondary btn-small ml-2" onClick={() => window.location.reload()}>
              Reload the newer copy
            </button>
          ) : null}
        </p>
        <button type="button" className="btn btn-secondary" onClick={() => void saveNow()} disabled={state.kind === "saving"}>
          Save now
        </button>
        <button
          type="button"
          className="btn btn-primary"
          onClick={() => void askToPublish()}
          disabled={publishing || confirming || problems.length > 0}
          aria-describedby={problems.length ? "publish-why-not" : undefined}
        >
          {publishing ? "Publishing…" : "Publish…"}
        </button>
        <button type="button" className="btn btn-secondary" onClick={() => void done()}>
          Done
        </button>
        {problems.length ? (
          <details className="notice-todo w-full" id="publish-why-not">
            <summary className="cursor-pointer">
              {problems.length === 1 ? "One thing" : `${problems.length} things`} to finish before publishing (the draft is saved as it is)
            </summary>
            <ul className="mt-2 list-disc pl-6" aria-label="To finish before publishing">
              {problems.map((p) => (
                <li key={`${p.field} ${p.message}`}>{p.message}</li>
              ))}
            </ul>
          </details>
        ) : null}
        {confirming ? (
          <div role="alertdialog" aria-labelledby="publish-question" className="notice-todo flex w-full flex-wrap items-center gap-3">
            <p id="publish-question" className="mr-auto">
              Publish version {versionNumber ?? base.number} of “{getValues("title")}”? Students assigned this card will run this version,
              and it cannot be changed afterwards: a later change makes a new version.
            </p>
            <button type="button" className="btn btn-primary" onClick={() => void publish()} autoFocus>
              Publish now
            </button>
            <button type="button" className="btn btn-secondary" onClick={() => setConfirming(false)}>
              Not yet
            </button>
          </div>
        ) : null}
        {/* In the bar that stays on screen: a reason nobody sees is no reason at all. */}
        {publishError ? (
          <p role="alert" className="notice-error w-full">
            Not published: {publishError}
          </p>
        ) : null}
      </div>

      {tab === "preview" ? (
        <CardView version={toPreview(getValues(), base, subjectName(getValues("subjectId")))} />
      ) : (
        <form className="flex flex-col gap-5" onSubmit={(e) => e.preventDefault()} aria-label="Task card">
          <section className="panel grid gap-4 sm:grid-cols-2" aria-label="About the card">
            <label className="field sm:col-span-2">
              <span className="label">Title</span>
              <input className="input text-lg" {...register("title")} />
              {formState.errors.title ? <span className="field-error">{formState.errors.title.message}</span> : todo("title")}
            </label>
            <label className="field">
              <span className="label">Curriculum subject</span>
              <select className="input" {...register("subjectId")}>
                <option value="">Choose a subject</option>
                {subjects.map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.name}
                  </option>
                ))}
              </select>
              {todo("subjectId")}
            </label>
            <label className="field">
              <span className="label">ATA chapter</span>
              <input className="input w-28" inputMode="numeric" maxLength={2} placeholder="27" {...register("ataChapter")} />
              {todo("ataChapter")}
            </label>
            <label className="field">
              <span className="label">Applicability (models, comma-separated)</span>
              <input className="input" {...register("applicability")} />
            </label>
            <label className="field">
              <span className="label">Estimated time (minutes)</span>
              <input className="input w-36" inputMode="numeric" {...register("estimatedMinutes")} />
              {todo("estimatedMinutes")}
            </label>
            <label className="field">
              <span className="label">Protective equipment (one per line)</span>
              <textarea className="input min-h-24" {...register("protectiveEquipment")} />
            </label>
            <label className="field">
              <span className="label">Tools (one per line)</span>
              <textarea className="input min-h-24" {...register("tools")} />
            </label>
            <ToolRoomPicker
              onPick={(line) => {
                const current = getValues("tools").trim();
                if (!current.split("\n").some((l) => l.trim() === line))
                  setValue("tools", current ? `${current}\n${line}` : line, { shouldDirty: true });
              }}
            />
            <label className="field sm:col-span-2">
              <span className="label">Consumables (one per line)</span>
              <textarea className="input min-h-20" {...register("consumables")} />
            </label>
          </section>

          <h2>Steps</h2>
          {steps.fields.map((field, index) => (
            <StepEditor
              key={field.key}
              index={index}
              count={steps.fields.length}
              control={control}
              register={register}
              setValue={setValue}
              manuals={manuals}
              onMove={(from, to) => steps.move(from, to)}
              onRemove={() => steps.remove(index)}
              onCiteFromReader={(stepId) => void citeFromReader(stepId)}
              problems={problems.filter((p) => p.field.startsWith(`steps.${index + 1}.`)).map((p) => p.message)}
            />
          ))}
          <button type="button" className="btn btn-secondary self-start" onClick={() => steps.append(emptyStep())}>
            + Add a step
          </button>
        </form>
      )}
    </div>
  );
}
