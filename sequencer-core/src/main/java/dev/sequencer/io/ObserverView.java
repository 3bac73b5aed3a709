package dev.sequencer.io;

import dev.sequencer.model.Constraints;

/**
 * One observer as the request rules see it: the top level's ({@code resource} null) or one resource's (A6),
 * its kind as far as the reader could tell, and the constraints a request's own replace there (the
 * scenario's, with a resource's own fields over them).
 */
record ObserverView(String resource, ObserverKind kind, Constraints constraints) {
  /** The one observer of a file without resources. */
  static ObserverView single(ObserverKind kind, Constraints scenarioConstraints) {
    return new ObserverView(null, kind, scenarioConstraints);
  }

  /** For messages: {@code oneObserver} ("the scenario", "this one") without resources, else the resource by id. */
  String subject(String oneObserver) {
    return resource == null ? oneObserver : "resource \"" + resource + "\" (allowed to observe it)";
  }

  /** The constraints a request's own replace here, and where they come from for messages. */
  ConstraintsParser.Inherited inherited() {
    return new ConstraintsParser.Inherited(constraints, resource == null ? ConstraintsParser.FROM_SCENARIO
        : " (as inherited on resource \"" + resource + "\")");
  }
}
