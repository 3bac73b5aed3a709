package dev.sequencer.planner;

import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.validate.PlanValidator;

/** One scenario made ready by {@link Planner#prepare}: its geometry, planning problem and full validator. */
public record Prepared(Geometry geometry, PlanningProblem problem, PlanValidator validator) {}
