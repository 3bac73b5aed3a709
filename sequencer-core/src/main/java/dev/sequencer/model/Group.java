package dev.sequencer.model;

import java.util.List;
import java.util.Objects;

/**
 * A group of requests (format addition A5). {@code allOrNothing}: every member is scheduled (all its visits)
 * or none is. {@code ordered}: each scheduled member starts after the previous scheduled member (in list
 * order) ends; {@code maxGapS} (ordered groups only, {@code null} for none): and at most this long after
 * it. {@code sameResource} is for several resources (A6) and has no effect with one observer.
 */
public record Group(String id, List<String> members, boolean allOrNothing, boolean ordered, Double maxGapS,
    boolean sameResource) {
  public Group {
    Objects.requireNonNull(id, "id");
    members = List.copyOf(members);
    Checks.finiteOrNull("maxGapS", maxGapS);
  }
}
