/**
 * What the casebook API returns. Customer and site details (customer, site, address, system,
 * job reference, the test's own title and notes, which name them) are only in `details`, and
 * `details` is null for everyone but owners and leads.
 */
import { storyOf } from "@/lib/verdict/story";
import type { AcceptanceProfile, Decay, Verdict } from "@/analysis/decay/types";
import type { EntryDetailRow } from "@/db/queries/casebook";
import { canReadAllTests, type Role } from "@/lib/permissions";

/** Owners and leads see whose job a casebook curve came from; trainers, technicians and apprentices do not. */
export function seesCustomerDetails(role: Role): boolean {
  return role === "owner" || role === "lead";
}

export interface CasebookPinDto {
  id: string;
  atSeconds: number;
  text: string;
}

export interface CasebookEntryDetails {
  testTitle: string;
  testNotes: string | null;
  customerName: string | null;
  siteName: string | null;
  siteAddress: string | null;
  systemName: string | null;
  jobReference: string | null;
}

export interface CasebookEntryDto {
  id: string;
  collectionId: string;
  title: string;
  notes: string | null;
  order: number;
  testId: string;
  /** Whether the viewer may open the test page itself (visibility rule). */
  canOpenTest: boolean;
  testedAt: string;
  technicianName: string;
  refrigerant: string | null;
  lineSetFeet: number | null;
  /** True when the analysis is withheld (an apprentice's uncalled practice test). */
  analysisHidden: boolean;
  verdict: Verdict | null;
  /** The profile half of the story: whether the test met the shop's profile, in words (lib/verdict). */
  meetsProfile: boolean | null;
  profileSentence: string | null;
  /** The hold in one sentence, from the engine's figures (lib/verdict/story.ts). */
  holdSentence: string | null;
  isolationAt: number | null;
  decay: Decay | null;
  profile: Pick<AcceptanceProfile, "targetMicrons" | "limitMicrons"> | null;
  series: { t: number[]; p: number[] };
  pins: CasebookPinDto[];
  details: CasebookEntryDetails | null;
}

export interface CasebookViewer {
  userId: string;
  role: Role;
}

export function toEntryDto(row: EntryDetailRow, pins: CasebookPinDto[], viewer: CasebookViewer, analysisHidden: boolean): CasebookEntryDto {
  const e = row.entry;
  const r = analysisHidden ? null : row.result;
  return {
    id: e.id,
    collectionId: e.collectionId,
    title: e.title,
    notes: e.notes,
    order: e.order,
    testId: e.testId,
    canOpenTest: canReadAllTests(viewer.role) || row.testCreatedById === viewer.userId,
    testedAt: row.testedAt.toISOString(),
    technicianName: row.technicianName,
    refrigerant: row.refrigerant,
    lineSetFeet: row.lineSetFeet,
    analysisHidden,
    verdict: r?.verdict ?? null,
    meetsProfile: r?.meetsProfile ?? null,
    profileSentence: r ? storyOf(r).profile.sentence : null,
    holdSentence: r ? storyOf(r).holdSentence : null,
    isolationAt: r?.isolationAt ?? null,
    decay: r?.decay ?? null,
    profile: r ? { targetMicrons: r.profile.targetMicrons, limitMicrons: r.profile.limitMicrons } : null,
    series: row.series ?? { t: [], p: [] },
    pins,
    details: seesCustomerDetails(viewer.role)
      ? {
          testTitle: row.testTitle,
          testNotes: row.testNotes,
          customerName: row.customerName,
          siteName: row.siteName,
          siteAddress: row.siteAddress,
          systemName: row.systemName,
          jobReference: row.jobReference,
        }
      : null,
  };
}
