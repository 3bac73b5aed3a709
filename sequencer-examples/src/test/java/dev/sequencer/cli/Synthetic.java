package dev.sequencer.cli;

import com.fasterxml.jackson.databind.json.JsonMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.Random;

/** Invented scenarios for the reliability tests, built as JSON trees. */
final class Synthetic {
  static final JsonMapper JSON = JsonMapper.builder().build();

  private Synthetic() {}

  /** The skeleton: format, name, horizon [start, start + hours], fixed slew, empty requests. */
  static ObjectNode base(Instant start, double hours, double slewS) {
    ObjectNode s = JSON.createObjectNode();
    s.put("format", 1);
    s.put("name", "synthetic reliability scenario");
    s.putObject("horizon").put("start", start.toString())
        .put("end", start.plusSeconds((long) (hours * 3600)).toString());
    s.putObject("slew").put("model", "fixed").put("seconds", slewS);
    s.putArray("requests");
    return s;
  }

  /** Adds {@code n} windows-only requests (no observer): one random window each, whole-second durations. */
  static ObjectNode windowsOnly(ObjectNode s, int n, Random r) {
    Instant h0 = Instant.parse(s.at("/horizon/start").textValue());
    long horizonS = Instant.parse(s.at("/horizon/end").textValue()).getEpochSecond() - h0.getEpochSecond();
    ArrayNode reqs = (ArrayNode) s.get("requests");
    for (int i = 0; i < n; i++) {
      long dur = 60 + r.nextInt(15) * 60L;
      long len = Math.min(horizonS, dur + 600 + r.nextInt(7200));
      long from = (long) (r.nextDouble() * (horizonS - len));
      ObjectNode q = reqs.addObject();
      q.put("id", "S" + (i + 1));
      q.put("durationS", dur);
      q.put("priority", 1 + r.nextInt(9));
      q.putArray("windows").addArray().add(h0.plusSeconds(from).toString()).add(h0.plusSeconds(from + len).toString());
    }
    return s;
  }

  /** An invented ground site. */
  static ObjectNode ground(ObjectNode s, double latDeg, double lonDeg) {
    ObjectNode g = s.putObject("observer").putObject("ground");
    g.put("latitudeDeg", latDeg).put("longitudeDeg", lonDeg).put("altitudeM", 500);
    return s;
  }

  /** Adds a fixed RA/Dec request. */
  static ObjectNode raDec(ObjectNode s, String id, double raDeg, double decDeg, long durS, double priority) {
    ObjectNode q = ((ArrayNode) s.get("requests")).addObject();
    q.put("id", id);
    q.putObject("target").put("raDeg", raDeg).put("decDeg", decDeg);
    q.put("durationS", durS);
    q.put("priority", priority);
    return q;
  }

  static ObjectNode eigenaxis(ObjectNode s) {
    s.putObject("slew").put("model", "eigenaxis").put("rateDegPerS", 1.0).put("accelDegPerS2", 0.1)
        .put("settleS", 10);
    return s;
  }

  static Path write(ObjectNode s, Path file) {
    try {
      Files.writeString(file, JSON.writerWithDefaultPrettyPrinter().writeValueAsString(s));
      return file;
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }
}
