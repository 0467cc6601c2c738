import type { Study } from '@provenote/shared/schemas';
import { ExportBundles } from '../../../bundles/components/ExportBundles';

/** Export: result bundles of the signed-off study (built by the PI, downloadable by the lab). */
export function ExportCard({ labId, study, isPi }: { labId: string; study: Study; isPi: boolean }) {
  return <ExportBundles labId={labId} studyId={study.id} signedOff={study.signedOffAt !== null} isPi={isPi} />;
}
