// Where the PDFs' running footer (page number, "statistics, not guarantees") sits on the A4 page.
//
// Why a top offset and not `bottom`: with @react-pdf/renderer 4.9 a fixed, absolutely placed box
// anchored with `bottom` is dropped from every page as soon as its text has a line height — and
// both documents set one on the page, which the footer inherits. Anchored from the top it prints.

/** A4 height in PDF points (297 mm). Both documents are A4 only. */
export const A4_HEIGHT_PT = 841.89;

/** The footer's top edge for a footer `heightPt` tall whose bottom edge is `bottomPt` above the page's. */
export function footerTopPt(bottomPt: number, heightPt: number): number {
  return A4_HEIGHT_PT - bottomPt - heightPt;
}
