import { assetStatusWords, type AssetStatus } from "@/lib/domain/fleet/fleet";

const tone: Record<AssetStatus, string> = {
  airworthy: "bg-ok-pale text-ok",
  instructional: "bg-teal-pale text-ink",
  ground_run: "bg-amber-pale text-ink",
  out_of_service: "bg-danger-pale text-danger",
};

/** An asset's status in words, its colour only a second cue. */
export function AssetStatusBadge({ status }: { status: AssetStatus }) {
  return <span className={`badge font-bold ${tone[status]}`}>{assetStatusWords[status]}</span>;
}
