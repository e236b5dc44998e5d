/** One entry of GET /api/profiles: a profile with its embryo's metadata. */
export interface ProfileItem {
  profileId: number;
  embryoId: number;
  embryo: string;
  genotype: string;
  stage: string | null;
  ageS: number | null;
  lengthUm: number | null;
  dosage: number | null;
  session: string | null;
  metadata: Record<string, string>;
  channel: string;
  timeS: number | null;
  positionUnit: string;
  pixelSizeUm: number | null;
  nPoints: number;
  droppedPoints: number;
  flipped: boolean;
  importId: number;
  fileName: string;
  rangeUm: [number, number];
}

export interface ProfilePage {
  total: number;
  limit: number;
  offset: number;
  items: ProfileItem[];
}
