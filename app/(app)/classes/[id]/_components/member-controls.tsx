"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormResult } from "@/components/form-result";
import { ApiError, call } from "@/lib/client/api";
import { classesApi } from "@/lib/contracts/endpoints/classes";

export function AddMembersForm({ classId, candidates }: { classId: string; candidates: { id: string; label: string }[] }) {
  const router = useRouter();
  const [chosen, setChosen] = useState<string[]>([]);
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<{ ok: boolean; message: string } | null>(null);

  if (!candidates.length) return <p className="panel">Everyone with an account is already in this class.</p>;

  return (
    <form
      className="panel flex flex-col gap-4"
      aria-labelledby="add-members-title"
      onSubmit={async (event) => {
        event.preventDefault();
        if (!chosen.length) {
          setResult({ ok: false, message: "Choose at least one person." });
          return;
        }
        setBusy(true);
        try {
          const { added } = await call(classesApi.addMembers, { params: { id: classId }, body: { userIds: chosen } });
          setResult({ ok: true, message: `${added} added to the class.` });
          setChosen([]);
          router.refresh();
        } catch (error) {
          setResult({ ok: false, message: error instanceof ApiError ? error.message : "Nobody was added." });
        } finally {
          setBusy(false);
        }
      }}
    >
      <h2 id="add-members-title">Add people</h2>
      <FormResult result={result} />
      <fieldset className="flex max-h-80 flex-col gap-1 overflow-y-auto">
        <legend className="label mb-2">Choose one or more</legend>
        {candidates.map((c) => (
          <label key={c.id} className="flex min-h-11 cursor-pointer items-center gap-3">
            <input
              type="checkbox"
              className="h-6 w-6"
              checked={chosen.includes(c.id)}
              onChange={(e) => setChosen((list) => (e.target.checked ? [...list, c.id] : list.filter((x) => x !== c.id)))}
            />
            {c.label}
          </label>
        ))}
      </fieldset>
      <button type="submit" className="btn btn-primary self-start" disabled={busy}>
        Add {chosen.length || ""} to class
      </button>
    </form>
  );
}

export function RemoveMemberButton({ classId, userId, name }: { classId: string; userId: string; name: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  return (
    <button
      type="button"
      className="btn btn-danger btn-small"
      disabled={busy}
      aria-label={`Remove ${name} from the class`}
      onClick={async () => {
        setBusy(true);
        try {
          await call(classesApi.removeMember, { params: { id: classId, userId } });
          router.refresh();
        } catch (error) {
          window.alert(error instanceof ApiError ? error.message : "Not removed.");
        } finally {
          setBusy(false);
        }
      }}
    >
      Remove
    </button>
  );
}
