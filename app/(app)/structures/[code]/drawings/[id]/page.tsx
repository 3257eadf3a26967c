import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { DeleteDrawingButton } from "@/components/drawings/delete-drawing-button";
import { DrawingBoard, type BoardGauge } from "@/components/drawings/drawing-board";
import { PageHeader } from "@/components/ui/page-header";
import { may } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { fileId } from "@/lib/files/schema";
import { getDrawing } from "@/lib/services/files";
import { listGauges } from "@/lib/services/gauges";
import { gaugeStatuses } from "@/lib/services/status";
import { conditionText, shownState } from "@/lib/alerting/condition-display";
import { getVisibleStructure } from "@/lib/services/structures";

type Props = { params: Promise<{ code: string; id: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  return { title: `Drawing · ${(await params).code}` };
}

export default async function DrawingPage({ params }: Props) {
  const { code, id } = await params;
  const drawingId = fileId.safeParse(id);
  if (!drawingId.success) notFound();
  const user = await requireUser();
  const structure = await pageGuard(getVisibleStructure(user, code));
  const [drawing, gauges, statuses, canPlace] = await Promise.all([
    pageGuard(getDrawing(user, code, drawingId.data)),
    pageGuard(listGauges(user, code)),
    gaugeStatuses(structure),
    may(user, "gauge:register", structure),
  ]);
  const statusOf = new Map(statuses.map((status) => [status.tag, status]));
  // Only what the board shows goes to the browser.
  const boardGauges: BoardGauge[] = gauges.map((gauge) => {
    const status = statusOf.get(gauge.tag)!;
    return {
      tag: gauge.tag,
      label: gauge.label ?? null,
      state: shownState(status.condition, status.retired),
      stateText: conditionText(status.condition, status.retired),
      placement: gauge.drawing,
    };
  });
  return (
    <>
      <PageHeader
        title={drawing.title}
        subtitle={
          <Link href={`/structures/${encodeURIComponent(structure.code)}`} className="font-medium text-accent underline-offset-2 hover:underline">
            ← {structure.name} <span className="font-mono">({structure.code})</span>
          </Link>
        }
        actions={canPlace && <DeleteDrawingButton url={drawing.url} title={drawing.title} structureCode={structure.code} />}
      />
      <DrawingBoard structureCode={structure.code} drawing={drawing} gauges={boardGauges} canPlace={canPlace} />
    </>
  );
}
