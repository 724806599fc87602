// Package sheets renders printable PDF build sheets for a batch of coils:
// a cover page with the bill of materials, then one page per coil with a
// side view drawn at true 1:1 scale, the winding steps, the predicted values
// and room to log measurements, and for a coil tuned by a two-gang
// capacitor a second page charting both tuning ranges across the dial.
//
// Render takes plain data (Document): the model's coil.Prediction for each
// coil and sheets' own structs for the tap and the two-gang chart. It never
// re-derives physics; the only arithmetic here is layout and the batch
// totals of the bill of materials.
//
// # Scale
//
// Pages are A4 (210 × 297 mm) or US Letter (8.5 × 11 in) and all drawing is
// in millimetres, so 1 mm on the page is 72/25.4 PDF points. The side view,
// the 50 mm scale-check bar and the cut-out pitch template are drawn at 1:1.
// Printers often rescale ("fit to page"); every coil page therefore carries
// the scale bar and tells the builder to measure it before trusting the
// drawing. A coil too large for the drawing area is drawn at the largest of
// 1:2, 1:5 or 1:10 that fits and labelled "NOT FULL SIZE"; one too large
// even at 1:10 is drawn as a schematic labelled "NOT TO SCALE". A coil
// under 10 mm across, unreadable at 1:1, gets an enlarged detail (5:1 …
// 2:1, labelled "NOT FULL SIZE") beside its true-size view. The scale bar
// and the pitch template stay 1:1.
//
// # Pages that grow
//
// The cover's first page always holds the title, "Before you start" and
// the cautions; the job's notes, the coil list and the bill of materials
// follow and continue on as many pages as they take, table heads repeated.
// A coil's notes continue on a page after its own. Text is wrapped (a word
// wider than the line is broken), never dropped and never drawn below the
// footer line; only labels (a title, a coil's name) are shortened with an
// ellipsis. Cautions are on the cover's first page and on every coil page.
//
// # Lettering
//
// The PDF core font Helvetica in the Windows-1252 encoding: it needs no
// embedded font file, every PDF reader has it, and the output is byte-for-byte
// reproducible. That encoding has µ, ×, ±, °, ¼, ½ and ¾ but not Ω, so
// resistance is written "ohm". Black on white, no fills lighter than mid
// grey: the sheets survive a black-and-white photocopier. The only colour
// is in the plots (the match map's matched loads are dark green dots, the
// others grey crosses), where shape alone also tells them apart.
//
// # Numbers
//
// Predicted values and the dimensions checked with calipers are printed as
// `turnwise predict` prints them. Lengths the builder cuts are rounded to
// what a ruler gives: the wire to cut and the leads to the millimetre (0.01
// in), and the bill of materials totals those printed lengths times the
// quantities, so it adds up by hand; the stock to have, with its allowance,
// is rounded up to 10 mm (1 in).
//
// # Side view
//
// The wire is drawn as a helix seen from the side with its true pitch: the
// front half of each turn solid at the wire's overall diameter, the back half
// dashed, and a dot where the wire crosses the top and bottom silhouette. The
// outside length printed (and measured with calipers) is the model's
// (N−1)·p + d_o; it is dimensioned centred on the winding, where for a whole
// number of turns it spans the bottom row of crossings exactly.
package sheets
