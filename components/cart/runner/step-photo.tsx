"use client";

import { useState } from "react";
import type { CartData } from "@/lib/client/cart/store";
import { maxPhotoBytes, photoTypes } from "@/lib/domain/validation/runs";
import type { Act } from "./use-run";

/** A photo of the work: checked here, queued in the store, then named by a photo event. */
export function StepPhoto({
  stepId,
  count,
  disabled,
  onAct,
  data,
  runId,
}: {
  stepId: string;
  count: number;
  disabled: boolean;
  onAct: Act;
  data: CartData;
  runId: string;
}) {
  // Shown beside the photo field, where the student is looking, not at the top of the card.
  const [photoProblem, setPhotoProblem] = useState<string | null>(null);
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={`photo-${stepId}`} className="label">
        Photo of the work {count ? `(${count} added)` : ""}
      </label>
      <input
        id={`photo-${stepId}`}
        type="file"
        accept={photoTypes.join(",")}
        capture="environment"
        className="input"
        disabled={disabled}
        onChange={async (e) => {
          const file = e.target.files?.[0];
          e.target.value = "";
          setPhotoProblem(null);
          if (!file) return;
          if (!(photoTypes as readonly string[]).includes(file.type))
            return setPhotoProblem("Only JPEG, PNG or WebP pictures can be added.");
          if (file.size > maxPhotoBytes)
            return setPhotoProblem(
              `That picture is ${(file.size / 1048576).toFixed(1)} MB; at most ${maxPhotoBytes / 1048576} MB. Take it at a lower resolution.`,
            );
          const photoId = crypto.randomUUID();
          await data.queuePhoto({ photoId, runId, stepId, type: file.type, blob: file });
          await onAct("photo.added", { stepId, payload: { key: photoId } });
        }}
      />
      {photoProblem ? (
        <p role="alert" className="notice-error">
          {photoProblem}
        </p>
      ) : null}
    </div>
  );
}
