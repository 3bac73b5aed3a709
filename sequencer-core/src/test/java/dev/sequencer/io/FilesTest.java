package dev.sequencer.io;

import static dev.sequencer.io.Docs.at;
import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.model.Observation;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Writers' exact output, the windows and timeline files, and atomic writes. */
class FilesTest {
  private static final Instant T0 = Instant.parse("2031-05-04T18:00:00Z");

  private static Timeline timeline() {
    return new Timeline(PlanStatus.FEASIBLE, 7.5, 84.2, null,
        List.of(new Observation("R1", T0.plusMillis(250), T0.plusSeconds(600), 84.2, null, Observation.DONE),
            new Observation("R9", T0.plusSeconds(700), T0.plusSeconds(1000), 0, 2.5, null)),
        List.of(new Unscheduled("R7", "never visible")));
  }

  @Test
  void scenarioWriterOutputIsExact() {
    Scenario s = new Scenario(1, null, new TimeWindow(T0, T0.plusSeconds(3600)), null, null,
        new SlewSettings.Matrix(List.of(List.of(0.0, 12.5), List.of(12.0, -0.0)), null), null,
        List.of(Request.of("A", null, 600, 5).withWindows(List.of(new TimeWindow(T0, T0.plusMillis(1500)))),
            Request.of("B", null, 0, 1.25).withWindows(List.of(new TimeWindow(T0, T0.plusSeconds(10))))),
        null);
    String expected = """
        {
          "format": 1,
          "horizon": {
            "start": "2031-05-04T18:00:00Z",
            "end": "2031-05-04T19:00:00Z"
          },
          "slew": {
            "model": "matrix",
            "seconds": [
              [0, 12.5],
              [12, -0.0]
            ]
          },
          "requests": [
            {
              "id": "A",
              "durationS": 600,
              "priority": 5,
              "windows": [
                ["2031-05-04T18:00:00Z", "2031-05-04T18:00:01.500Z"]
              ]
            },
            {
              "id": "B",
              "durationS": 0,
              "priority": 1.25,
              "windows": [
                ["2031-05-04T18:00:00Z", "2031-05-04T18:00:10Z"]
              ]
            }
          ]
        }
        """;
    assertEquals(expected, ScenarioWriter.toJson(s));
    assertEquals(s, ScenarioReader.parse(expected).scenario());
  }

  @Test
  void timelineOutputIsExactAndOmitsUnknownBound() {
    String expected = """
        {
          "format": 1,
          "status": "FEASIBLE",
          "objective": {
            "priority": 7.5,
            "slewSeconds": 84.2
          },
          "observations": [
            {
              "id": "R1",
              "start": "2031-05-04T18:00:00.250Z",
              "end": "2031-05-04T18:10:00Z",
              "slewSeconds": 84.2,
              "state": "done"
            },
            {
              "id": "R9",
              "start": "2031-05-04T18:11:40Z",
              "end": "2031-05-04T18:16:40Z",
              "slewSeconds": 0,
              "value": 2.5
            }
          ],
          "unscheduled": [
            {
              "id": "R7",
              "reason": "never visible"
            }
          ]
        }
        """;
    assertEquals(expected, TimelineFile.toJson(timeline()));
    assertEquals(timeline(), TimelineFile.parse(expected, "t"));
  }

  @Test
  void timelineBoundRoundTripsAndNullMeansUnknown() {
    Timeline t = new Timeline(PlanStatus.OPTIMAL, 42, 1234.5, 45.0, List.of(), List.of());
    assertEquals(t, TimelineFile.parse(TimelineFile.toJson(t), "t"));
    String withNull = TimelineFile.toJson(timeline()).replace("\"status\"", "\"bound\": null, \"status\"");
    assertEquals(timeline(), TimelineFile.parse(withNull, "t"));
  }

  @Test
  void slewDepartureAndWaypointsRoundTrip() {
    // Spec A3: "slewStart" (ISO-8601) and "slewVia" ([[raDeg, decDeg], ...]) on an observation.
    Instant t0 = Instant.parse("2031-05-04T19:00:00Z");
    Observation ob = new Observation("R1", t0, t0.plusSeconds(300), 61.5, null, null, t0.minusSeconds(90),
        List.of(new RaDec(10.5, -20.25), new RaDec(359.0, 89.0)));
    Timeline t = new Timeline(PlanStatus.FEASIBLE, 1, 61.5, null, List.of(ob), List.of());
    String json = TimelineFile.toJson(t);
    assertTrue(json.replace(" ", "").contains("\"slewStart\":\"2031-05-04T18:58:30Z\""), json);
    assertEquals(t, TimelineFile.parse(json, "t"));
  }

  @Test
  void badSlewDepartureAndWaypointsHavePaths() {
    String bad = """
        {"format": 1, "status": "FEASIBLE", "objective": {"priority": 1, "slewSeconds": 0},
         "observations": [
           {"id": "R1", "start": "2031-05-04T19:00:00Z", "end": "2031-05-04T19:10:00Z", "slewSeconds": 0,
            "slewStart": "2031-05-04T19:01:00Z", "slewVia": [[360, 0], [10], [5, 91]]}],
         "unscheduled": []}""";
    List<Problem> ps = assertThrows(ScenarioException.class, () -> TimelineFile.parse(bad, "t")).problems();
    assertTrue(at(ps, "observations[0] (id \"R1\").slewStart").message().contains("after the observation's start"));
    at(ps, "observations[0] (id \"R1\").slewVia[0][0]");
    at(ps, "observations[0] (id \"R1\").slewVia[1]");
    at(ps, "observations[0] (id \"R1\").slewVia[2][1]");
    assertEquals(4, ps.size());
  }

  @Test
  void timelineProblemsHavePaths() {
    String bad = """
        {"format": 1, "status": "OPTIMUM", "objective": {"priority": 1, "slewSeconds": -1},
         "observations": [
           {"id": "R1", "start": "2031-05-04T19:00:00Z", "end": "2031-05-04T18:00:00Z", "slewSeconds": 0,
            "state": "finished"},
           {"id": "R2", "start": "2031-05-04T18:30:00Z", "end": "2031-05-04T18:40:00Z", "slewSeconds": NaN}],
         "unscheduled": [{"id": "R1", "reason": "x"}, {"id": "R3"}]}""";
    List<Problem> ps = assertThrows(ScenarioException.class, () -> TimelineFile.parse(bad, "t")).problems();
    assertEquals("must be one of OPTIMAL, FEASIBLE, INFEASIBLE, NO_SOLUTION_IN_TIME (did you mean OPTIMAL?)"
        + " (was \"OPTIMUM\")", at(ps, "status").message());
    at(ps, "objective.slewSeconds");
    assertEquals("must be one of done, running, planned (was \"finished\")",
        at(ps, "observations[0] (id \"R1\").state").message());
    at(ps, "observations[0] (id \"R1\").end");
    assertTrue(at(ps, "observations[1] (id \"R2\").start").message().contains("time order"));
    at(ps, "observations[1] (id \"R2\").slewSeconds");
    assertEquals("duplicate id, already used by observations[0]", at(ps, "unscheduled[0] (id \"R1\").id").message());
    assertEquals("is required", at(ps, "unscheduled[1] (id \"R3\").reason").message());
    assertEquals(8, ps.size());
  }

  @Test
  void windowsFileRoundTripsAndChecksOrder() {
    List<RequestWindows> w = List.of(
        new RequestWindows("R1", List.of(new TimeWindow(T0.plusMillis(3250), T0.plusSeconds(60)),
            new TimeWindow(T0.plusSeconds(90), T0.plusSeconds(90)))),
        new RequestWindows("R2", List.of()));
    String json = WindowsFile.toJson(w);
    assertEquals(w, WindowsFile.parse(json, "w"));
    assertTrue(json.contains("[\"2031-05-04T18:00:03.250Z\", \"2031-05-04T18:01:00Z\"]"), json);
    String bad = """
        {"format": 1, "windows": [
          {"id": "R1", "intervals": [["2031-05-04T18:00:00Z", "2031-05-04T18:10:00Z"],
                                     ["2031-05-04T18:05:00Z", "2031-05-04T18:20:00Z"]]},
          {"id": "R1", "intervals": [], "extra": 1}]}""";
    List<Problem> ps = assertThrows(ScenarioException.class, () -> WindowsFile.parse(bad, "w")).problems();
    assertTrue(at(ps, "windows[0] (id \"R1\").intervals[1]").message().contains("ordered and disjoint"));
    at(ps, "windows[1] (id \"R1\").id");
    at(ps, "windows[1] (id \"R1\").extra");
  }

  @Test
  void windowsFileOfOneObserverIsExact() {
    String expected = """
        {
          "format": 1,
          "windows": [
            {
              "id": "R1",
              "intervals": [
                ["2031-05-04T18:00:00Z", "2031-05-04T18:01:00Z"]
              ]
            }
          ]
        }
        """;
    List<RequestWindows> w = List.of(new RequestWindows("R1", List.of(new TimeWindow(T0, T0.plusSeconds(60)))));
    assertEquals(expected, WindowsFile.toJson(w));
  }

  @Test
  void windowsFileCarriesPassesThatAreCheckedWhenRead() {
    List<RequestWindows> w = List.of(new RequestWindows("SAT1", List.of(new TimeWindow(T0.plusSeconds(120),
        T0.plusSeconds(480)))), new RequestWindows("R2", List.of()));
    WindowsFile.Pass pass = new WindowsFile.Pass(T0, T0.plusSeconds(300), 41.25, T0.plusSeconds(600));
    String json = WindowsFile.toJson(w, (res, id) -> id.equals("SAT1") ? List.of(pass) : List.of());
    assertTrue(json.replaceAll("\\s", "").contains("\"passes\":[{\"rise\":\"2031-05-04T18:00:00Z\","
        + "\"culmination\":\"2031-05-04T18:05:00Z\",\"culminationElevationDeg\":41.25,\"set\":\"2031-05-04T18:10:00Z\"}]"),
        json);
    assertEquals(1, json.split("\"passes\"", -1).length - 1, "no passes written for R2: " + json);
    assertEquals(w, WindowsFile.parse(json, "w"), "the passes are informational: the windows read back");
    String bad = """
        {"format": 1, "windows": [
          {"id": "SAT1", "intervals": [], "passes": [
            {"rise": "2031-05-04T18:10:00Z", "culmination": "2031-05-04T18:05:00Z", "culminationElevationDeg": 41,
             "set": "2031-05-04T18:20:00Z"},
            {"rise": "2031-05-04T18:15:00Z", "culmination": "2031-05-04T18:16:00Z", "culminationElevationDeg": 95,
             "set": "2031-05-04T18:17:00Z", "azimuth": 3}]}]}""";
    List<Problem> ps = assertThrows(ScenarioException.class, () -> WindowsFile.parse(bad, "w")).problems();
    assertTrue(at(ps, "windows[0] (id \"SAT1\").passes[0]").message().contains("rise <= culmination <= set"), ps.toString());
    at(ps, "windows[0] (id \"SAT1\").passes[1].culminationElevationDeg");
    at(ps, "windows[0] (id \"SAT1\").passes[1].rise");
    at(ps, "windows[0] (id \"SAT1\").passes[1].azimuth");
  }

  @Test
  void windowsFileByResourceIsExactAndRoundTrips() {
    // Spec A6: one entry per request and allowed resource, { "id", "resource", "intervals" }.
    List<WindowsFile.ResourceWindows> w = List.of(
        new WindowsFile.ResourceWindows("north", List.of(
            new RequestWindows("R1", List.of(new TimeWindow(T0, T0.plusSeconds(60)))),
            new RequestWindows("R2", List.of()))),
        new WindowsFile.ResourceWindows("south", List.of(
            new RequestWindows("R1", List.of(new TimeWindow(T0.plusSeconds(30), T0.plusSeconds(90)))))));
    String expected = """
        {
          "format": 1,
          "windows": [
            {
              "id": "R1",
              "resource": "north",
              "intervals": [
                ["2031-05-04T18:00:00Z", "2031-05-04T18:01:00Z"]
              ]
            },
            {
              "id": "R2",
              "resource": "north",
              "intervals": []
            },
            {
              "id": "R1",
              "resource": "south",
              "intervals": [
                ["2031-05-04T18:00:30Z", "2031-05-04T18:01:30Z"]
              ]
            }
          ]
        }
        """;
    assertEquals(expected, WindowsFile.toJsonByResource(w));
    assertEquals(w, WindowsFile.parseByResource(expected, "w"));
  }

  @Test
  void windowsEntriesByResourceAreGroupedInTheOrderResourcesFirstAppear() {
    String interleaved = """
        {"format": 1, "windows": [
          {"id": "R1", "resource": "south", "intervals": []},
          {"id": "R1", "resource": "north", "intervals": []},
          {"id": "R2", "resource": "south", "intervals": []}]}""";
    List<WindowsFile.ResourceWindows> w = WindowsFile.parseByResource(interleaved, "w");
    assertEquals(List.of("south", "north"), w.stream().map(WindowsFile.ResourceWindows::resource).toList());
    assertEquals(List.of("R1", "R2"), w.get(0).windows().stream().map(RequestWindows::id).toList());
  }

  @Test
  void windowsEntriesNameAResourceExactlyInAFileByResource() {
    String bad = """
        {"format": 1, "windows": [
          {"id": "R1", "resource": "north", "intervals": []},
          {"id": "R1", "resource": "north", "intervals": []},
          {"id": "R2", "intervals": []},
          {"id": "R3", "resource": "", "intervals": []}]}""";
    List<Problem> ps = assertThrows(ScenarioException.class, () -> WindowsFile.parseByResource(bad, "w")).problems();
    Problem dup = at(ps, "windows[1] (id \"R1\").id");
    assertEquals("duplicate id for resource \"north\", already used by windows[0]", dup.message());
    assertEquals("R1", dup.value());
    assertEquals("is required", at(ps, "windows[2] (id \"R2\").resource").message());
    assertEquals("must not be empty (was \"\")", at(ps, "windows[3] (id \"R3\").resource").message());
    assertEquals(3, ps.size(), ps.toString());
    ps = assertThrows(ScenarioException.class, () -> WindowsFile.parse(bad, "w")).problems();
    Problem one = at(ps, "windows[0] (id \"R1\").resource");
    assertEquals("must be absent: these windows are read for one observer (entries name a resource only for a "
        + "scenario with resources, A6)", one.message());
    assertEquals("north", one.value());
  }

  @Test
  void timelineObservationsCarryTheirResource() {
    // Spec A6: every observation carries "resource"; different visits of one request may use different ones.
    Instant t0 = Instant.parse("2031-05-04T19:00:00Z");
    Timeline t = new Timeline(PlanStatus.FEASIBLE, 2, 30, null,
        List.of(new Observation("R1", t0, t0.plusSeconds(300), 10, null, null, null, List.of(), 1, "north"),
            new Observation("R1", t0.plusSeconds(100), t0.plusSeconds(400), 20, null, null, null, List.of(), 2,
                "south")),
        List.of());
    String json = TimelineFile.toJson(t);
    assertTrue(json.contains("""
              "id": "R1",
              "resource": "south",
              "visit": 2,
        """), json);
    assertEquals(t, TimelineFile.parse(json, "t"));
  }

  @Test
  void aResourceDoesNotMakeASecondObservationOfARequestLegal() {
    String bad = """
        {"format": 1, "status": "FEASIBLE", "objective": {"priority": 1, "slewSeconds": 0},
         "observations": [
           {"id": "R1", "resource": "north", "start": "2031-05-04T19:00:00Z", "end": "2031-05-04T19:10:00Z",
            "slewSeconds": 0},
           {"id": "R1", "resource": "south", "start": "2031-05-04T19:00:00Z", "end": "2031-05-04T19:10:00Z",
            "slewSeconds": 0},
           {"id": "R2", "resource": " ", "start": "2031-05-04T19:20:00Z", "end": "2031-05-04T19:30:00Z",
            "slewSeconds": 0}],
         "unscheduled": []}""";
    List<Problem> ps = assertThrows(ScenarioException.class, () -> TimelineFile.parse(bad, "t")).problems();
    assertEquals("duplicate id, already used by observations[0]", at(ps, "observations[1] (id \"R1\").id").message());
    assertEquals("must not be empty (was \" \")", at(ps, "observations[2] (id \"R2\").resource").message());
    assertEquals(2, ps.size(), ps.toString());
  }

  @Test
  void writersReplaceFilesAtomicallyAndLeaveNoTemporaryFile(@TempDir Path dir) throws Exception {
    Path file = dir.resolve("plan.json");
    Files.writeString(file, "old");
    TimelineFile.write(timeline(), file);
    byte[] first = Files.readAllBytes(file);
    TimelineFile.write(TimelineFile.read(file), file);
    assertArrayEquals(first, Files.readAllBytes(file));
    try (Stream<Path> files = Files.list(dir)) {
      assertEquals(List.of(file), files.toList());
    }
    Path scenario = dir.resolve("s.json");
    Scenario s = Docs.read(Docs.base()).scenario();
    ScenarioWriter.write(s, scenario);
    assertEquals(s, ScenarioReader.read(scenario).scenario());
    Path windows = dir.resolve("w.json");
    List<RequestWindows> w = List.of(new RequestWindows("R1", List.of(new TimeWindow(T0, T0.plusSeconds(5)))));
    WindowsFile.write(w, windows);
    assertEquals(w, WindowsFile.read(windows));
    List<WindowsFile.ResourceWindows> byResource = List.of(new WindowsFile.ResourceWindows("north", w));
    WindowsFile.writeByResource(byResource, windows);
    assertEquals(byResource, WindowsFile.readByResource(windows));
  }

  @Test
  void writingToAMissingDirectoryFailsWithTheTargetNamed(@TempDir Path dir) {
    Path file = dir.resolve("no/such/dir/plan.json");
    var e = assertThrows(java.io.UncheckedIOException.class, () -> TimelineFile.write(timeline(), file));
    assertTrue(e.getMessage().contains("plan.json"), e.getMessage());
  }

  @Test
  void raDecTargetWritesAsRaDec() {
    Scenario s = Docs.read(Docs.base()).scenario();
    assertTrue(ScenarioWriter.toJson(s).contains("\"target\": {\n        \"raDeg\": 10,\n        \"decDeg\": -20\n"));
    assertEquals(new RaDec(10, -20), s.requests().get(0).target());
  }
}
