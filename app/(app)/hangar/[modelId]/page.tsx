import type { Metadata } from "next";
import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { db } from "@/db";
import { listModelLanes, listRecentLaunchHeights } from "@/db/queries/model-record";
import { getModel, listRepairs } from "@/db/queries/models";
import { waitingOfferOf } from "@/db/queries/model-offers";
import { getSessionUser } from "@/lib/auth/session";
import { classCautions } from "@/lib/hangar/limits";
import { modelStats } from "@/lib/hangar/stats";
import { modelIdSchema } from "@/lib/validations/hangar";
import { MassOverTime } from "../_components/mass-over-time";
import { ModelActions } from "../_components/model-actions";
import { ModelRecord } from "../_components/model-record";
import { RepairForm } from "../_components/repair-form";
import { STATUS_LABEL } from "../_components/status";

export const metadata: Metadata = { title: "Model" };
export const dynamic = "force-dynamic";

/** One model: its figures, class cautions, record (launch heights, flights), repairs and mass over time. Someone else's model is a 404. */
export default async function ModelPage({ params }: { params: Promise<{ modelId: string }> }) {
  const user = await getSessionUser();
  if (!user) redirect("/sign-in");
  const parsed = modelIdSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const model = await getModel(db, { ownerId: user.id, modelId: parsed.data.modelId });
  if (!model) notFound();
  const [repairs, lanes, heights, offer] = await Promise.all([
    listRepairs(db, { ownerId: user.id, modelId: model.id }),
    listModelLanes(db, { modelId: model.id, ownerIds: [model.ownerId, ...model.formerOwnerIds] }),
    listRecentLaunchHeights(db, { modelId: model.id, limit: 20 }),
    waitingOfferOf(db, { sellerId: user.id, modelId: model.id }),
  ]);
  const stats = modelStats(model.id, lanes);
  return (
    <div className="space-y-6">
      <header className="space-y-1">
        <Link href="/hangar" className="text-sm font-bold underline">‹ Hangar</Link>
        <h1 className="text-2xl font-extrabold">{model.name}</h1>
        <p>{model.spanMm} mm · {model.massG} g · {STATUS_LABEL[model.status]}{model.marking ? ` · ${model.marking}` : ""}</p>
        {model.notes ? <p className="text-sm text-muted">{model.notes}</p> : null}
        {classCautions(model).map((c) => <p key={c} className="font-semibold text-warn">Caution: {c}</p>)}
      </header>
      <ModelRecord stats={stats} repairs={repairs.length} heights={heights} />
      <section aria-labelledby="repairs-h" className="space-y-3">
        <h2 id="repairs-h" className="text-lg font-bold">Repairs</h2>
        {repairs.length === 0 ? <p className="text-muted">No repairs logged.</p> : (
          <ul className="space-y-1">
            {repairs.map((r) => <li key={r.id}><span className="figures">{r.repairedOn}</span> — {r.work}{r.massAfterG ? ` (${r.massAfterG} g after)` : ""}</li>)}
          </ul>
        )}
        <MassOverTime points={repairs.filter((r) => r.massAfterG !== null).map((r) => ({ date: r.repairedOn, massG: r.massAfterG! }))} />
        <RepairForm modelId={model.id} />
      </section>
      <ModelActions
        modelId={model.id} status={model.status}
        offer={offer ? { email: offer.email, withHistory: offer.withHistory, expiresOn: offer.expiresAt.toISOString().slice(0, 10) } : null}
      />
    </div>
  );
}
