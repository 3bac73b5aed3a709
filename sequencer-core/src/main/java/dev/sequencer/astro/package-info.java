/**
 * The offline astronomy context: time scales from a bundled leap-second table, Earth frames with no
 * Earth-orientation data, and Sun and Moon position providers (Sun within 0.65 arcsec, Moon within about 18 arcsec).
 *
 * <p>Nothing here touches Orekit's JVM-wide default {@code DataContext}; every Orekit object is built
 * from the {@link dev.sequencer.astro.AstroContext} passed in.
 */
package dev.sequencer.astro;
