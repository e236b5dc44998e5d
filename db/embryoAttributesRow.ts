/** An embryo's attributes as stored in its `embryos` row (columns genotype … metadata_json). */
export interface EmbryoAttributesRow {
  genotype: string;
  stage: string | null;
  ageS: number | null;
  lengthUm: number | null;
  dosage: number | null;
  session: string | null;
  metadata: Record<string, string>;
}

/** Read an embryo's attributes from a row selected with the `embryos` column names. */
export function embryoAttributesOf(r: Record<string, unknown>): EmbryoAttributesRow {
  return {
    genotype: r.genotype as string,
    stage: r.stage as string | null,
    ageS: r.age_s as number | null,
    lengthUm: r.length_um as number | null,
    dosage: r.dosage as number | null,
    session: r.session as string | null,
    metadata: JSON.parse(r.metadata_json as string),
  };
}
