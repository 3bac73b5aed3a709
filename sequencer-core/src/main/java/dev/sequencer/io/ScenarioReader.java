package dev.sequencer.io;

import com.fasterxml.jackson.databind.JsonNode;
import dev.sequencer.model.Scenario;
import java.io.InputStream;
import java.nio.file.Path;
import java.util.List;
import java.util.Objects;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Reads a scenario file (format 1, see {@code shared/spec/scenario-format.md}) and checks every rule
 * of the format, reporting all problems at once in a {@link ScenarioException}.
 *
 * <p>Choices the format leaves open: longitudes may be given in [-180, 360); ground altitudes must lie
 * in [-1000, 10000] m; a TLE whose epoch is more than 3650 days from the horizon is an error, more
 * than 30 days a warning; request windows that touch (one ends where the next starts) count as
 * overlapping; {@code windows: []} is an error (omit the field instead); a JSON {@code null} counts as
 * an absent field. With several resources (A6) a request must be valid for every resource allowed to observe
 * it, so one request cannot be allowed on a resource with an observer and on one without; the scenario's
 * {@code slew} is then the first resource's (docs/format-notes.md). I/O failures are
 * {@link java.io.UncheckedIOException}s.
 */
public final class ScenarioReader {
  private static final Logger LOG = LoggerFactory.getLogger(ScenarioReader.class);

  private ScenarioReader() {}

  /** A valid scenario and the adjustments made while reading it (e.g. windows clipped to the horizon). */
  public record Result(Scenario scenario, List<String> warnings) {
    public Result {
      Objects.requireNonNull(scenario, "scenario");
      warnings = List.copyOf(warnings);
    }
  }

  /** Reads a UTF-8 scenario file; problems are reported under the file's name. */
  public static Result read(Path file) {
    long t0 = System.nanoTime();
    Result r = parse(Json.read(file), file.toString());
    LOG.debug("read {}: {} requests, in {} ms", file, r.scenario().requests().size(),
        (System.nanoTime() - t0) / 1_000_000);
    return r;
  }

  /** Reads UTF-8 scenario JSON from a stream (not closed). */
  public static Result read(InputStream in) {
    return parse(Json.read(in), "scenario");
  }

  /** Reads scenario JSON text. */
  public static Result parse(String json) {
    return parse(json, "scenario");
  }

  /** Reads scenario JSON text; {@code source} names it in the exception message. */
  public static Result parse(String json, String source) {
    Problems problems = new Problems();
    JsonNode root = Json.parseObject(json, source, problems);
    Scenario scenario = root == null ? null : new ScenarioParser(problems).parse(root);
    problems.throwIfAny(source);
    return new Result(scenario, problems.warnings());
  }
}
