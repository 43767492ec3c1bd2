import type { Metadata } from "next";
import Link from "next/link";
import { requirePageUser } from "@/app/_adapters/session";
import { getEnv } from "@/lib/server/env";
import { formatBytes } from "@/lib/domain/library/format";
import { UploadForm } from "../_components/upload-form";

export const metadata: Metadata = { title: "Upload a manual" };

export default async function UploadPage() {
  await requirePageUser("library:manage", "/library/upload");
  return (
    <div className="flex max-w-3xl flex-col gap-6">
      <Link href="/library" className="self-start py-2">
        ← Library
      </Link>
      <h1>Upload a manual</h1>
      <p className="text-ink-soft">
        A PDF of up to {formatBytes(getEnv().HL_UPLOAD_LIMIT_BYTES)}. Hangarleaf reads every page (scanned pages too) before the manual
        shows in the library; until then nobody else sees it.
      </p>
      <UploadForm mode={{ kind: "manual" }} />
    </div>
  );
}
