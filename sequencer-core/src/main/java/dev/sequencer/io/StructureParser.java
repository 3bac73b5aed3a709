package dev.sequencer.io;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import dev.sequencer.model.Group;
import dev.sequencer.model.Reconfiguration;
import dev.sequencer.model.Request;
import dev.sequencer.model.Resource;
import dev.sequencer.model.Visits;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.Predicate;

/**
 * Reads the format's additions A4 and A5: a request's {@code visits} and {@code configuration}, the
 * scenario's (or a resource's, A6) {@code reconfiguration}, the scenario's {@code groups} and
 * {@code startConfiguration}, and the rules across them (members that exist, one group per request, no
 * visits in ordered groups, every label in the table it meets).
 */
final class StructureParser {
  static final List<String> VISITS = List.of("count", "minSeparationS", "maxSeparationS", "onePerWindow", "allOrNothing");
  static final List<String> GROUP = List.of("id", "members", "allOrNothing", "ordered", "maxGapS", "sameResource");
  static final List<String> RECONFIGURATION = List.of("labels", "seconds", "concurrentWithSlew");
  /** The most visits one request may ask for (a guard on the model's size, not a rule of the trade). */
  static final int MAX_VISITS = 1000;

  private final Problems p;

  StructureParser(Problems problems) {
    this.p = problems;
  }

  /** A request's {@code visits}, or {@link Visits#ONCE} when absent (null after a reported problem). */
  Visits visits(Fields request) {
    Fields f = request.object("visits", false, VISITS);
    if (f == null) {
      return request.has("visits") ? null : Visits.ONCE;
    }
    int before = p.count();
    Integer count = f.integer("count", true, Range.closed(1, MAX_VISITS));
    Double min = f.number("minSeparationS", false, Range.NON_NEGATIVE);
    Double max = f.number("maxSeparationS", false, Range.NON_NEGATIVE);
    Boolean one = f.bool("onePerWindow", false);
    Boolean all = f.bool("allOrNothing", false);
    if (min != null && max != null && max < min) {
      p.add(f.path("maxSeparationS"), "must be >= minSeparationS " + Range.num(min) + " (was " + Range.num(max) + ")",
          Range.num(max));
    }
    if (p.count() != before) {
      return null;
    }
    return new Visits(count, min == null ? 0 : min, max, Boolean.TRUE.equals(one), Boolean.TRUE.equals(all));
  }

  /** A request's {@code configuration} label, {@code ""} when absent. */
  String configuration(Fields request) {
    String c = request.text("configuration", false);
    return c == null ? "" : c;
  }

  /** The scenario's {@code groups}, checked against the requests (which may be null when they were invalid). */
  List<Group> groups(Fields top, List<Request> requests) {
    ArrayNode a = top.array("groups", false);
    List<Group> out = new ArrayList<>();
    if (a == null) {
      return out;
    }
    Map<String, Request> byId = new HashMap<>();
    if (requests != null) {
      requests.forEach(r -> byId.put(r.id(), r));
    }
    Map<String, String> groupOf = new HashMap<>();
    Map<String, Integer> groupIds = new HashMap<>();
    String path = top.path("groups");
    for (int i = 0; i < a.size(); i++) {
      JsonNode n = a.get(i);
      Fields f = Fields.of(n, RequestParser.label(path, i, n), p, GROUP);
      if (f == null) {
        continue;
      }
      int before = p.count();
      String id = f.get("id", true) == null ? null : Values.id(n.get("id"), f.path("id"), p);
      if (id != null && groupIds.putIfAbsent(id, i) != null) {
        p.add(f.path("id"), "duplicate group id, already used by " + path + "[" + groupIds.get(id) + "]", id);
      }
      Boolean all = f.bool("allOrNothing", false);
      Boolean ordered = f.bool("ordered", false);
      Double gap = f.number("maxGapS", false, Range.NON_NEGATIVE);
      Boolean same = f.bool("sameResource", false);
      if (gap != null && !Boolean.TRUE.equals(ordered)) {
        p.add(f.path("maxGapS"), "is for ordered groups only; this group is not ordered", Range.num(gap));
      }
      List<String> members = new ArrayList<>();
      ArrayNode m = f.array("members", true);
      if (m != null) {
        if (m.size() < 2) {
          p.add(f.path("members"), "must list at least two request ids", Problems.text(m));
        }
        Set<String> seen = new LinkedHashSet<>();
        for (int j = 0; j < m.size(); j++) {
          String mp = f.path("members") + "[" + j + "]";
          String rid = Values.id(m.get(j), mp, p);
          if (rid == null) {
            continue;
          }
          if (!seen.add(rid)) {
            p.add(mp, "request listed twice in this group", rid);
            continue;
          }
          Request r = byId.get(rid);
          if (requests != null && r == null) {
            p.add(mp, "no request has this id" + Suggest.hint(rid, List.copyOf(byId.keySet())), rid);
            continue;
          }
          String other = groupOf.putIfAbsent(rid, id == null ? "?" : id);
          if (other != null) {
            p.add(mp, "request already belongs to group \"" + other + "\" (a request belongs to at most one group)", rid);
          }
          if (r != null && Boolean.TRUE.equals(ordered) && r.hasVisits()) {
            p.add(mp, "members of ordered groups have no visits; request \"" + rid + "\" has "
                + r.visits().count(), rid);
          }
          members.add(rid);
        }
      }
      if (p.count() == before && id != null) {
        out.add(new Group(id, members, Boolean.TRUE.equals(all), Boolean.TRUE.equals(ordered), gap,
            Boolean.TRUE.equals(same)));
      }
    }
    return out;
  }

  /**
   * The {@code reconfiguration} of {@code owner} (the scenario, or a resource), {@link Reconfiguration#NONE}
   * when absent (null after a problem).
   */
  Reconfiguration reconfiguration(Fields owner) {
    Fields f = owner.object("reconfiguration", false, RECONFIGURATION);
    if (f == null) {
      return owner.has("reconfiguration") ? null : Reconfiguration.NONE;
    }
    int before = p.count();
    Boolean concurrent = f.bool("concurrentWithSlew", false);
    boolean c = concurrent == null || concurrent;
    ArrayNode labelNodes = f.array("labels", false);
    JsonNode sec = f.get("seconds", true);
    if (labelNodes == null) {
      if (sec == null) {
        return null;
      }
      Double s = Values.number(sec, f.path("seconds"), p, Range.NON_NEGATIVE);
      return s == null ? null : Reconfiguration.constant(s, c);
    }
    List<String> labels = new ArrayList<>();
    for (int i = 0; i < labelNodes.size(); i++) {
      String lp = f.path("labels") + "[" + i + "]";
      String l = Values.text(labelNodes.get(i), lp, p);
      if (l != null && labels.contains(l)) {
        p.add(lp, "label listed twice", l);
      }
      labels.add(l);
    }
    if (labels.isEmpty()) {
      p.add(f.path("labels"), "must list at least one label", "[]");
    }
    if (sec == null) {
      return null;
    }
    int n = labels.size();
    String sp = f.path("seconds");
    if (!Values.isArray(sec, sp, p, n, "an array of " + n + " rows (one per label)")) {
      return null;
    }
    double[][] table = new double[n][n];
    for (int i = 0; i < n; i++) {
      String rp = sp + "[" + i + "]";
      if (!Values.isArray(sec.get(i), rp, p, n, "a row of " + n + " seconds")) {
        continue;
      }
      for (int j = 0; j < n; j++) {
        Double v = Values.number(sec.get(i).get(j), rp + "[" + j + "]", p, Range.NON_NEGATIVE);
        table[i][j] = v == null ? 0 : v;
        if (v != null && i == j && v != 0) {
          p.add(rp + "[" + j + "]", "must be 0: the same configuration needs no change", Range.num(v));
        }
      }
    }
    return p.count() == before ? new Reconfiguration(labels, 0, table, c) : null;
  }

  /** Every configuration label used (requests and start) must be in the table, when a table is given. */
  void checkLabels(Fields top, Reconfiguration re, String start, List<Request> requests) {
    checkLabels(top, "reconfiguration", re, start, requests, r -> true, new HashSet<>());
  }

  /**
   * With resources (A6): the start and the configuration of every request a resource may observe must be
   * among the labels of the table that resource uses, its own or else the scenario's {@code re}; each
   * problem is reported once. Resources that could not be read are skipped.
   */
  void checkLabels(Fields top, Reconfiguration re, String start, List<Request> requests,
      List<ResourceParser.Entry> resources) {
    Set<String> reported = new HashSet<>();
    for (ResourceParser.Entry e : resources) {
      Resource r = e.resource();
      if (r == null) {
        continue;
      }
      boolean own = r.reconfiguration() != null;
      checkLabels(top, own ? e.path() + ".reconfiguration" : "reconfiguration", own ? r.reconfiguration() : re,
          start, requests, q -> q.allows(r.id()), reported);
    }
  }

  /**
   * The labels {@code start} and those of the requests {@code on} the table at {@code tablePath} applies to
   * must be among its labels; a problem whose key is in {@code reported} was already given.
   */
  private void checkLabels(Fields top, String tablePath, Reconfiguration re, String start, List<Request> requests,
      Predicate<Request> on, Set<String> reported) {
    if (re == null || re.labels().isEmpty()) {
      return;
    }
    String rule = "not among " + tablePath + ".labels " + re.labels();
    if (!re.labels().contains(start) && reported.add(tablePath)) {
      p.add(top.path("startConfiguration"), rule, start);
    }
    if (requests == null) {
      return;
    }
    for (int k = 0; k < requests.size(); k++) {
      Request q = requests.get(k);
      if (on.test(q) && !re.labels().contains(q.configuration()) && reported.add(tablePath + "|" + k)) {
        p.add(top.path("requests") + "[" + k + "] (id \"" + q.id() + "\").configuration", rule, q.configuration());
      }
    }
  }
}
