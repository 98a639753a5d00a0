// The figures that turn a run's grid into a plain-language rating, each with where it comes from. Kept in one
// place so that the accuracy panel, the band tables and the tests all read the same numbers.

/**
 * Cells per wavelength at a band's upper edge below which the band is "not resolved" and left out of every
 * band table and chart. Ten is common practice for levels from a second-order scheme; for this scheme the
 * verification notes measured, at 10 cells per wavelength or more, thin-screen insertion loss within 0.4 dB of
 * the exact half-plane solution and the absorption of an impedance wall within 0.03 (/work/shared
 * verification notes, "measured for this scheme"). Nothing is promised below it.
 */
export const RESOLVED_POINTS_PER_WAVELENGTH = 10;

/**
 * Phase error (degrees) accumulated over the longest source-receiver distance above which a resolved band is
 * "use with care". Derived here, not taken from a standard: two equally strong paths that should add in phase
 * but are 45 degrees apart lose 20 log10 cos(22.5 deg) = 0.69 dB, about the level error the notes measured at
 * 10 cells per wavelength for a thin screen; beyond it interference dips (ground, barrier fringes) move by a
 * noticeable part of their width.
 */
export const CAREFUL_PHASE_ERROR_DEGREES = 45;

/**
 * A receiver closer than this many cells to a surface or a PML gets a warning. Our choice, from what the
 * scheme does: a surface sits on the staircase of cell faces to within half a cell (a thin screen acts as if
 * its edge were 0.4 to 0.5 cells further out, measured for this scheme), and a receiver interpolates from the
 * four nearest cell centres, so within three cells the receiver's distance to the surface is uncertain by a
 * sixth or more.
 */
export const NEAR_SURFACE_CELLS = 3;

/**
 * A wall, solid or opening narrower than this many cells is drawn with a thickness uncertain by a whole cell
 * (the rasteriser keeps cells whose centre lies inside), i.e. by half its size or more. Issue #9 asks for two.
 */
export const THIN_FEATURE_CELLS = 2;

/**
 * Final energy this many dB below its peak counts as decayed. Derived: for an exponentially decaying tail the
 * energy a trace misses after it stops is the final-to-peak ratio of the whole, so 20 dB down leaves out
 * 1 % (0.04 dB of level); a trace cut earlier also smears its spectrum (the rectangular window).
 */
export const DECAYED_DB = 20;

/** Fraction of a trace taken as its tail when the run kept no energy history. */
export const TAIL_FRACTION = 0.1;
