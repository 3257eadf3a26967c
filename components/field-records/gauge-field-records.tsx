import type { UserActor } from "@/lib/auth/actor";
import { cardClass } from "@/components/ui/styles";
import { CertificatesSection } from "./certificates-section";

/** The gauge's field records: its calibration certificates. */
export function GaugeFieldRecords({ user, code, tag }: { user: UserActor; code: string; tag: string }) {
  return (
    <div className={`${cardClass} mt-6 space-y-6 p-4`}>
      <CertificatesSection user={user} code={code} gauge={tag} />
    </div>
  );
}
