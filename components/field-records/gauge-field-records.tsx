import type { UserActor } from "@/lib/auth/actor";
import { cardClass } from "@/components/ui/styles";
import { CertificatesSection } from "./certificates-section";
import { GaugeVisitsSection } from "./gauge-visits-section";

/** The gauge's field records: its calibration certificates and the site visits that name it. */
export function GaugeFieldRecords({ user, code, tag, timeZone }: { user: UserActor; code: string; tag: string; timeZone: string }) {
  return (
    <div className={`${cardClass} mt-6 space-y-6 p-4`}>
      <CertificatesSection user={user} code={code} gauge={tag} />
      <GaugeVisitsSection user={user} code={code} tag={tag} timeZone={timeZone} />
    </div>
  );
}
