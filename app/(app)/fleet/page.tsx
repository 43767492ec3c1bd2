import type { Metadata } from "next";
import Link from "next/link";
import { requirePageUser } from "@/app/_adapters/session";
import { can } from "@/lib/domain/access/permissions";
import { listAssets } from "@/lib/server/fleet/assets";
import { AddAssetForm } from "./_components/fleet-forms";
import { FleetTable } from "./_components/fleet-table";

export const metadata: Metadata = { title: "Fleet" };

export default async function FleetPage() {
  const user = await requirePageUser("fleet:view", "/fleet");
  const assets = await listAssets();
  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="mr-auto">Fleet</h1>
        <Link href="/hangar" className="btn btn-primary">
          Hangar plan
        </Link>
      </div>
      <p className="max-w-3xl">
        The aircraft, engines, propellers and components the school&apos;s work is done on. Open one to see what applies to it, what is
        installed on it, what students did on it and what was found.
      </p>
      <FleetTable assets={assets} />
      {can(user, "fleet:manage") ? <AddAssetForm /> : null}
    </div>
  );
}
