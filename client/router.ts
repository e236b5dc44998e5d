/** The page's views, in the order of the top bar. */
export const VIEWS = [
  { id: "data", title: "Data" },
  { id: "fits", title: "Fits" },
  { id: "precision", title: "Precision" },
  { id: "groups", title: "Groups" },
  { id: "dynamics", title: "Dynamics" },
] as const;

export type ViewId = (typeof VIEWS)[number]["id"];

/** The view named by a location hash ("#/fits" → "fits"); Data when it names none. */
export function viewFromHash(hash: string): ViewId {
  const id = hash.replace(/^#\/?/, "").split(/[/?]/)[0];
  return VIEWS.some((v) => v.id === id) ? (id as ViewId) : "data";
}
