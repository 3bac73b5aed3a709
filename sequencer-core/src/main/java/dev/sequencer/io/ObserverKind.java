package dev.sequencer.io;

/** What the scenario's observer is, as far as the reader could tell; INVALID disables the consistency rules. */
enum ObserverKind {
  NONE,
  GROUND,
  ORBIT,
  INVALID
}
