package dev.sequencer;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;
import static com.tngtech.archunit.library.dependencies.SlicesRuleDefinition.slices;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Who may import whom inside the library (DEVELOPERS.md's package table), checked on the compiled classes
 * so that the layout stays true after the people who drew it have moved on. Test classes are left out.
 */
class ArchitectureTest {
  private static JavaClasses classes;

  @BeforeAll
  static void importMainClasses() {
    classes = new ClassFileImporter().withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
        .importPackages("dev.sequencer");
  }

  /** No class of the packages {@code from} depends on a class of any package in {@code forbidden}. */
  private static void forbid(String from, String... forbidden) {
    noClasses().that().resideInAPackage(from).should().dependOnClassesThat().resideInAnyPackage(forbidden)
        .check(classes);
  }

  @Test
  void theModelDependsOnNothingOfOurs() {
    forbid("dev.sequencer.model..", "dev.sequencer.io..", "dev.sequencer.astro..", "dev.sequencer.slew..",
        "dev.sequencer.visibility..", "dev.sequencer.sequence..", "dev.sequencer.validate..", "dev.sequencer.planner..",
        "dev.sequencer.campaign..");
  }

  @Test
  void filesAstronomyAndSlewsDependOnTheModelOnly() {
    for (String p : new String[] {"dev.sequencer.io..", "dev.sequencer.astro..", "dev.sequencer.slew.."}) {
      forbid(p, other(p, "dev.sequencer.io..", "dev.sequencer.astro..", "dev.sequencer.slew..",
          "dev.sequencer.visibility..", "dev.sequencer.sequence..", "dev.sequencer.validate..",
          "dev.sequencer.planner.."));
    }
  }

  @Test
  void visibilityNeverSeesThePlanner() {
    forbid("dev.sequencer.visibility..", "dev.sequencer.sequence..", "dev.sequencer.validate..",
        "dev.sequencer.planner..", "dev.sequencer.io..");
  }

  @Test
  void theValidatorNeverImportsThePlannerNorTheVisibilityEngine() {
    forbid("dev.sequencer.validate..", "dev.sequencer.sequence..", "dev.sequencer.planner..",
        "dev.sequencer.visibility..", "dev.sequencer.slew..", "dev.sequencer.io..");
  }

  /**
   * The independent validator shares with the planner only the model, the time layer and Orekit (issue #14):
   * of our own code it may use {@code model} and, of {@code astro}, only {@link dev.sequencer.astro.AstroContext}
   * (leap seconds, time scales, Earth frames, and the Sun and Moon series, because the offline Orekit context
   * has no JPL ephemerides) and the leap-second table; none of the astro helpers the planner computes with
   * (aberration, apparent places, topocentric conversions, the series' classes themselves).
   */
  @Test
  void theValidatorSharesOnlyTheModelTheTimeLayerAndOrekit() {
    noClasses().that().resideInAPackage("dev.sequencer.validate..").should().dependOnClassesThat(
        com.tngtech.archunit.base.DescribedPredicate.describe("our code other than model, validate, AstroContext and "
            + "LeapSecondTable", (com.tngtech.archunit.core.domain.JavaClass c) -> c.getPackageName().startsWith(
                "dev.sequencer") && !c.getPackageName().startsWith("dev.sequencer.model")
                && !c.getPackageName().startsWith("dev.sequencer.validate")
                && !c.getName().equals("dev.sequencer.astro.AstroContext")
                && !c.getName().equals("dev.sequencer.astro.LeapSecondTable"))).check(classes);
  }

  @Test
  void theSequencerNeverComputesGeometry() {
    forbid("dev.sequencer.sequence..", "dev.sequencer.visibility..", "dev.sequencer.astro..", "dev.sequencer.planner..");
  }

  @Test
  void sequencerLayersPointDownwards() {
    // problem <- timing <- cpsat <- search / bound <- the run (sequence) <- replan
    forbid("dev.sequencer.sequence.problem..", "dev.sequencer.sequence.timing..", "dev.sequencer.sequence.cpsat..",
        "dev.sequencer.sequence.search..", "dev.sequencer.sequence.bound..", "dev.sequencer.sequence.replan..");
    for (String lower : new String[] {"problem", "timing", "cpsat", "search", "bound"}) {
      noClasses().that().resideInAPackage("dev.sequencer.sequence." + lower + "..").should().dependOnClassesThat()
          .resideInAPackage("dev.sequencer.sequence").check(classes);
    }
    forbid("dev.sequencer.sequence.timing..", "dev.sequencer.sequence.cpsat..", "dev.sequencer.sequence.search..",
        "dev.sequencer.sequence.bound..", "dev.sequencer.sequence.replan..");
    forbid("dev.sequencer.sequence.cpsat..", "dev.sequencer.sequence.search..", "dev.sequencer.sequence.bound..",
        "dev.sequencer.sequence.replan..");
    forbid("dev.sequencer.sequence.search..", "dev.sequencer.sequence.bound..", "dev.sequencer.sequence.replan..");
    forbid("dev.sequencer.sequence.bound..", "dev.sequencer.sequence.search..", "dev.sequencer.sequence.replan..");
    noClasses().that().resideInAPackage("dev.sequencer.sequence").should().dependOnClassesThat()
        .resideInAPackage("dev.sequencer.sequence.replan..").check(classes);
  }

  @Test
  void seasonsAndSweepsSitOnTopOfTheFacade() {
    // campaign uses the planner facade, the sequencer's re-planner and the files; nothing of the library uses it
    for (String p : new String[] {"dev.sequencer.model..", "dev.sequencer.io..", "dev.sequencer.astro..",
        "dev.sequencer.slew..", "dev.sequencer.visibility..", "dev.sequencer.sequence..", "dev.sequencer.validate..",
        "dev.sequencer.planner.."}) {
      forbid(p, "dev.sequencer.campaign..");
    }
    // it computes no geometry of its own beyond the Sun's elevation (astro), never the visibility engine directly
    forbid("dev.sequencer.campaign..", "dev.sequencer.visibility..", "dev.sequencer.slew..");
  }

  @Test
  void packagesHaveNoCycles() {
    slices().matching("dev.sequencer.(**)").should().beFreeOfCycles().check(classes);
  }

  private static String[] other(String self, String... all) {
    return java.util.Arrays.stream(all).filter(p -> !p.equals(self)).toArray(String[]::new);
  }
}
