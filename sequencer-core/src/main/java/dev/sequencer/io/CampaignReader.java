package dev.sequencer.io;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import dev.sequencer.model.Campaign;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * Reads a campaign file (docs/campaigns.md) and the scenario it names. Same conventions as the scenario
 * file: units in names, ISO-8601 dates, unknown fields refused with a "did you mean", every problem
 * reported at once with its JSON path as a {@link ScenarioException}. The programme's ids must be the
 * scenario's.
 */
public final class CampaignReader {
  static final List<String> TOP = List.of("format", "name", "scenario", "firstNight", "nights",
      "darknessSunElevationMaxDeg", "programme", "weather", "priorityAgeingPerNight");
  static final List<String> NEED = List.of("id", "seasonVisits", "exposureS");
  static final List<String> WEATHER = List.of("seed", "clearNightProbability", "cloudBlocksMax", "cloudBlockMinS",
      "cloudBlockMaxS", "failureFraction");
  /** Longest season read (about three years): guards against a typo such as 10000 nights. */
  public static final int MAX_NIGHTS = 1100;

  private CampaignReader() {}

  /** A campaign, the scenario it names (read from its own file) and the warnings of both. */
  public record Result(Campaign campaign, Scenario scenario, List<String> warnings) {
    public Result {
      warnings = List.copyOf(warnings);
    }
  }

  /** Reads {@code file} and the scenario it names (relative to the campaign file's folder). */
  public static Result read(Path file) {
    Campaign c = parse(Json.read(file), file.toString());
    Path dir = file.toAbsolutePath().getParent();
    Path scenarioPath = dir.resolve(c.scenarioFile());
    ScenarioReader.Result s = ScenarioReader.read(scenarioPath);
    checkProgramme(c, s.scenario(), file.toString());
    return new Result(c, s.scenario(), s.warnings());
  }

  /** Reads campaign JSON text (the scenario is not read); {@code source} names it in messages. */
  public static Campaign parse(String json, String source) {
    Problems p = new Problems();
    JsonNode root = Json.parseObject(json, source, p);
    Campaign c = root == null ? null : parse(root, p);
    p.throwIfAny(source);
    return c;
  }

  /** The programme's ids must be requests of the scenario; exposure needs a positive request duration. */
  public static void checkProgramme(Campaign c, Scenario s, String source) {
    List<Problem> problems = new ArrayList<>();
    Set<String> ids = new HashSet<>();
    s.requests().forEach(r -> ids.add(r.id()));
    for (int i = 0; i < c.programme().size(); i++) {
      Campaign.Need n = c.programme().get(i);
      if (!ids.contains(n.id())) {
        problems.add(new Problem("programme[" + i + "].id", "no request of the scenario has this id"
            + Suggest.hint(n.id(), ids) + " (was " + n.id() + ")", n.id()));
      } else if (n.exposureS() != null) {
        Request r = s.request(n.id()).orElseThrow();
        if (r.isFlexible() || r.durationS() <= 0) {
          problems.add(new Problem("programme[" + i + "].exposureS", "exposure needs a request of fixed duration > 0 "
              + "(request " + n.id() + (r.isFlexible() ? " is flexible" : " has durationS 0") + "); use seasonVisits",
              Double.toString(n.exposureS())));
        }
      }
    }
    if (!problems.isEmpty()) {
      throw new ScenarioException(source, problems);
    }
  }

  private static Campaign parse(JsonNode root, Problems p) {
    Fields top = Fields.of(root, "", p, TOP);
    Integer format = top.integer("format", true, Range.ANY);
    if (format != null && format != Campaign.FORMAT) {
      p.invalid("format", "must be " + Campaign.FORMAT, root.get("format"));
    }
    String name = top.text("name", false);
    String scenario = top.text("scenario", true);
    LocalDate first = date(top, "firstNight", p);
    Integer nights = top.integer("nights", true, Range.closed(1, MAX_NIGHTS));
    Double darkness = top.number("darknessSunElevationMaxDeg", false, Range.ELEVATION);
    List<Campaign.Need> programme = programme(top, p);
    Campaign.Weather weather = weather(top);
    Double ageing = top.number("priorityAgeingPerNight", false, Range.NON_NEGATIVE);
    if (p.count() > 0) {
      return null;
    }
    return new Campaign(format, name, scenario, first, nights, darkness, programme, weather,
        ageing == null ? 0 : ageing);
  }

  static LocalDate date(Fields f, String field, Problems p) {
    String text = f.text(field, true);
    if (text == null) {
      return null;
    }
    try {
      return LocalDate.parse(text);
    } catch (DateTimeParseException e) {
      p.add(f.path(field), "must be an ISO-8601 date such as 2031-05-04 (was " + text + ")", text);
      return null;
    }
  }

  private static List<Campaign.Need> programme(Fields top, Problems p) {
    ArrayNode a = top.array("programme", false);
    List<Campaign.Need> out = new ArrayList<>();
    if (a == null) {
      return out;
    }
    Set<String> seen = new HashSet<>();
    for (int i = 0; i < a.size(); i++) {
      String path = top.path("programme") + "[" + i + "]";
      Fields f = Fields.of(a.get(i), path, p, NEED);
      if (f == null) {
        continue;
      }
      String id = f.text("id", true);
      Integer visits = f.integer("seasonVisits", false, Range.closed(1, MAX_NIGHTS));
      Double exposure = f.number("exposureS", false, Range.POSITIVE);
      if (visits != null && exposure != null) {
        p.add(path, "give seasonVisits or exposureS, not both", null);
      }
      if (id != null && !seen.add(id)) {
        p.add(f.path("id"), "listed twice (was " + id + ")", id);
      }
      if (id != null) {
        out.add(new Campaign.Need(id, visits == null ? 1 : visits, exposure));
      }
    }
    return out;
  }

  private static Campaign.Weather weather(Fields top) {
    Fields w = top.object("weather", false, WEATHER);
    if (w == null) {
      return new Campaign.Weather(1, 1.0, 0, 0, 0, 0);
    }
    Integer seed = w.integer("seed", false, Range.ANY);
    Double clear = w.number("clearNightProbability", false, Range.closed(0, 1));
    Integer blocks = w.integer("cloudBlocksMax", false, Range.closed(0, 100));
    Double min = w.number("cloudBlockMinS", false, Range.NON_NEGATIVE);
    Double max = w.number("cloudBlockMaxS", false, Range.NON_NEGATIVE);
    Double fail = w.number("failureFraction", false, Range.closed(0, 1));
    double lo = min == null ? 1200 : min;
    double hi = max == null ? 5400 : max;
    if (hi < lo) {
      w.problems().add(w.path("cloudBlockMaxS"), "must be >= cloudBlockMinS (" + Range.num(lo) + ") (was "
          + Range.num(hi) + ")", Range.num(hi));
    }
    return new Campaign.Weather(seed == null ? 1 : seed, clear == null ? 1.0 : clear, blocks == null ? 3 : blocks,
        lo, hi, fail == null ? 0 : fail);
  }
}
