import { Alert, LinkButton } from "@/components/ui";
import { versionHref, type ShownAnalysis } from "./version";

/** Says plainly that the page shows an earlier analysis, with the way back to the current one. */
export function VersionBanner({ testId, shown }: { testId: string; shown: ShownAnalysis }) {
  return (
    <div data-testid="version-banner">
      <Alert
        tone="warning"
        title={`Showing analysis v${shown.version} of ${shown.versionCount}`}
        action={<LinkButton variant="secondary" href={versionHref(testId, null)}>Back to current</LinkButton>}
      >
        The verdict, curve and numbers below are as this earlier version found them. Review, comments and “Analyse again” work on the test as it is now.
      </Alert>
    </div>
  );
}
