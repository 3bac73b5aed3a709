package dev.sequencer.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

/**
 * Every file of the bad-input corpus ({@code src/test/resources/corpus/bad}), through every command that
 * reads a scenario: exit code 2, the expected JSON path and rule on stderr, no stack trace, no output
 * file. {@code expected-paths.tsv} beside the files gives the text each must print. The files in
 * {@code corpus/good} are the valid documents the bad ones were derived from (one edit each).
 */
class BadInputCorpusTest {
  static final Path BAD = Path.of("src/test/resources/corpus/bad");
  static final Path GOOD = Path.of("src/test/resources/corpus/good");

  static Map<String, String> expected() throws IOException {
    Map<String, String> out = new TreeMap<>();
    for (String line : Files.readAllLines(BAD.resolve("expected-paths.tsv"))) {
      if (line.isBlank() || line.startsWith("#")) {
        continue;
      }
      String[] parts = line.split("\t", 2);
      out.put(parts[0], parts[1]);
    }
    return out;
  }

  @Test
  void everyCorpusFileHasAnExpectationAndViceVersa() throws IOException {
    TreeSet<String> files = new TreeSet<>();
    try (Stream<Path> s = Files.list(BAD)) {
      s.map(p -> p.getFileName().toString()).filter(n -> n.endsWith(".json")).forEach(files::add);
    }
    assertEquals(files, new TreeSet<>(expected().keySet()));
    assertTrue(files.size() >= 30, "corpus has only " + files.size() + " files");
  }

  @Test
  void theGoodOriginalsAreValid() throws IOException {
    try (Stream<Path> s = Files.list(GOOD)) {
      for (Path p : s.sorted().toList()) {
        Runs.Run r = Runs.run("inspect", p.toString());
        assertEquals(0, r.code(), r::all);
      }
    }
  }

  @Test
  void everyScenarioCommandIsCovered() {
    // A new subcommand must be classified here (and, when it reads a scenario, added to
    // Runs.everyScenarioCommand) before this passes: the corpus then runs through it too.
    List<String> known = new ArrayList<>(Runs.READS_SCENARIO);
    known.addAll(Runs.READS_NO_SCENARIO);
    assertEquals(new TreeSet<>(known),
        new TreeSet<>(new CommandLine(new SequencerCli()).getSubcommands().keySet()));
  }

  @Test
  void everyBadFileIsRejectedByEveryCommandWithItsPath(@TempDir Path dir) throws IOException {
    Path timeline = dir.resolve("timeline.json");
    Runs.Run planned = Runs.run("plan", GOOD.resolve("windows-only.json").toString(), "--solver", "greedy",
        "-o", timeline.toString());
    assertEquals(0, planned.code(), planned::all);
    List<String> failures = new ArrayList<>();
    int runs = 0;
    for (Map.Entry<String, String> e : expected().entrySet()) {
      Path file = BAD.resolve(e.getKey());
      for (List<String> args : Runs.everyScenarioCommand(file, timeline, dir)) {
        Runs.Run r = Runs.run(args.toArray(new String[0]));
        runs++;
        String both = r.out() + r.err();
        if (r.code() != 2 || !r.err().contains(e.getValue()) || both.contains("\tat ")
            || both.contains("Exception")) {
          failures.add("expected exit 2 and \"" + e.getValue() + "\" on stderr\n" + r.all());
        }
      }
      for (String out : List.of("w.json", "t.json", "g.json")) {
        assertFalse(Files.exists(dir.resolve(out)), e.getKey() + ": " + out + " was written");
      }
    }
    assertEquals(List.of(), failures, failures.size() + " of " + runs + " runs failed");
  }
}
