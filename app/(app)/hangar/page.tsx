import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { db } from "@/db";
import { listModels } from "@/db/queries/models";
import { listOffersToMe } from "@/db/queries/model-offers";
import { getSessionUser } from "@/lib/auth/session";
import { classCautions } from "@/lib/hangar/limits";
import { ModelForm } from "./_components/model-form";
import { OffersToMe } from "./_components/offers-to-me";
import { STATUS_LABEL } from "./_components/status";

export const metadata: Metadata = { title: "Hangar" };
export const dynamic = "force-dynamic";

/** The pilot's models: what flies, what is in the workshop, what is put away or sold; models offered to them; add one. */
export default async function HangarPage() {
  const user = await getSessionUser();
  if (!user) redirect("/sign-in");
  const [models, offers] = await Promise.all([listModels(db, { ownerId: user.id }), listOffersToMe(db, { user })]);
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-extrabold">Hangar</h1>
      {offers.length ? <OffersToMe offers={offers.map((o) => ({ id: o.id, modelName: o.modelName, spanMm: o.spanMm, massG: o.massG, marking: o.marking, sellerName: o.sellerName, withHistory: o.withHistory }))} /> : null}
      {models.length === 0 ? <p className="text-muted">No models yet. Add the ones you fly to see which launches highest.</p> : (
        <ul className="space-y-2" aria-label="Your models">
          {models.map((m) => {
            const cautions = classCautions(m);
            return (
              <li key={m.id} className="rounded-xl border-2 border-line bg-raised p-3">
                <Link href={`/hangar/${m.id}`} className="text-lg font-bold underline">{m.name}</Link>
                <p className="text-sm">{m.spanMm} mm · {m.massG} g · {STATUS_LABEL[m.status]}{m.marking ? ` · ${m.marking}` : ""}</p>
                {cautions.length ? <p className="text-sm font-semibold text-warn">Caution: over the class limits (F3K.2.1)</p> : null}
              </li>
            );
          })}
        </ul>
      )}
      <section aria-labelledby="add-model" className="space-y-3">
        <h2 id="add-model" className="text-lg font-bold">Add a model</h2>
        <ModelForm />
      </section>
    </div>
  );
}
