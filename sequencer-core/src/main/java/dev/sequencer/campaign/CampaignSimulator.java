package dev.sequencer.campaign;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.io.Problem;
import dev.sequencer.io.ScenarioException;
import dev.sequencer.model.Campaign;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.planner.InputRules;
import dev.sequencer.planner.Planner;
import dev.sequencer.planner.Prepared;
import dev.sequencer.sequence.SequencerOptions;
import dev.sequencer.sequence.problem.Task;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Plays a season night by night with one strategy: each night's horizon from the darkness rule (ground
 * site: the Sun's centre at most the campaign's {@code darknessSunElevationMaxDeg}, else the scenario's
 * {@code sunElevationMaxDeg}; another observer: the UTC day), the requests that still need something
 * (explicit windows clipped to the night; one whose windows all miss it waits), priorities aged by the
 * nights since the request's last visit ({@code priority x (1 + ageing x nights)}, at most 1e9; flexible
 * requests keep their curve), the night executed against the seeded weather ({@link NightExecutor}), and
 * what was done carried forward. The nights and the weather are the same for every strategy.
 */
public final class CampaignSimulator {
  private final Campaign campaign;
  private final Scenario scenario;
  private final AstroContext ctx;
  private final SequencerOptions options;
  private final List<TimeWindow> windows = new ArrayList<>();
  private final List<NightWeather> weather = new ArrayList<>();

  /** A season of {@code campaign} over {@code scenario}; bad input (no darkness limit) as a {@link ScenarioException}. */
  public CampaignSimulator(Campaign campaign, Scenario scenario, AstroContext ctx, SequencerOptions options) {
    this.campaign = campaign;
    this.scenario = scenario;
    this.ctx = ctx;
    this.options = options;
    InputRules.check(scenario, "scenario");
    DarkNights dark = scenario.observer() instanceof GroundSite g ? new DarkNights(ctx, g) : null;
    Double limit = campaign.darknessSunElevationMaxDeg() != null ? campaign.darknessSunElevationMaxDeg()
        : scenario.constraints().sunElevationMaxDeg();
    if (dark != null && limit == null) {
      throw new ScenarioException("campaign", List.of(new Problem("darknessSunElevationMaxDeg", "is required: the "
          + "observer is a ground site and the scenario has no constraints.sunElevationMaxDeg", null)));
    }
    for (int i = 0; i < campaign.nights(); i++) {
      LocalDate d = campaign.firstNight().plusDays(i);
      TimeWindow w = dark != null ? dark.night(d, limit)
          : new TimeWindow(d.atStartOfDay().toInstant(ZoneOffset.UTC), d.plusDays(1).atStartOfDay().toInstant(ZoneOffset.UTC));
      windows.add(w);
      weather.add(w == null ? NightWeather.clear(i) : NightWeather.draw(campaign.weather(), i, w));
    }
  }

  /** Night {@code i}'s horizon ({@code null}: no darkness). */
  public TimeWindow night(int i) {
    return windows.get(i);
  }

  /** Night {@code i}'s weather. */
  public NightWeather weather(int i) {
    return weather.get(i);
  }

  /** What one request still needs, and what it earned. */
  private static final class Progress {
    final Request request;
    final Campaign.Need need;
    final double unitValue;
    int visits;
    double exposureS;
    int lastVisit = -1;

    Progress(Request r, Campaign.Need need) {
      this.request = r;
      this.need = need;
      this.unitValue = r.isFlexible() ? r.flexible().valueAt(r.flexible().maxDurationS()) : r.priority();
    }

    double remaining() {
      if (need.exposureS() != null) {
        return unitValue / request.durationS() * Math.max(0, need.exposureS() - exposureS);
      }
      return unitValue * Math.max(0, need.visits() - visits);
    }

    boolean complete() {
      return need.exposureS() != null ? exposureS >= need.exposureS() : visits >= need.visits();
    }
  }

  /** Plays the whole season with {@code strategy}. */
  public CampaignResult run(Strategy strategy) {
    long t0 = System.nanoTime();
    Map<String, Campaign.Need> needs = new HashMap<>();
    campaign.programme().forEach(n -> needs.put(n.id(), n));
    List<Progress> progress = new ArrayList<>();
    for (Request r : scenario.requests()) {
      progress.add(new Progress(r, needs.getOrDefault(r.id(), new Campaign.Need(r.id(), 1, null))));
    }
    double programme = progress.stream().mapToDouble(Progress::remaining).sum();
    double collectedTotal = 0;
    double shortfall = 0;
    int executedTotal = 0;
    int failedTotal = 0;
    int replanTotal = 0;
    List<NightRecord> records = new ArrayList<>();
    for (int i = 0; i < campaign.nights(); i++) {
      long n0 = System.nanoTime();
      LocalDate date = campaign.firstNight().plusDays(i);
      TimeWindow w = windows.get(i);
      List<Request> tonight = new ArrayList<>();
      Map<String, Progress> byId = new HashMap<>();
      int open = 0;
      for (Progress p : progress) {
        if (p.complete()) {
          continue;
        }
        open++;
        Request r = w == null ? null : tonight(p, w, i);
        if (r != null) {
          tonight.add(r);
          byId.put(r.id(), p);
        }
      }
      if (tonight.isEmpty()) {
        records.add(new NightRecord(strategy.label(), i + 1, date, w == null ? null : w.start(),
            w == null ? null : w.end(), w == null ? 0 : weather.get(i).cloudS(), 0, "NONE", 0, 0, 0, 0, 0,
            collectedTotal, remaining(progress), completed(progress), 0, (System.nanoTime() - n0) * 1e-9));
        continue;
      }
      Scenario s = new Scenario(scenario.format(), scenario.name(), w, scenario.observer(), scenario.constraints(),
          scenario.slew(), scenario.startPointing(), tonight, scenario.solver());
      Prepared prepared = Planner.prepare(s, ctx);
      NightExecutor.NightLog log = new NightExecutor(prepared.problem(), prepared.validator(), weather.get(i), options)
          .run(strategy);
      double collected = 0;
      double slew = 0;
      for (Observation o : log.executed().observations()) {
        Progress p = byId.get(o.id());
        slew += o.slewSeconds();
        p.lastVisit = i;
        if (p.need.exposureS() != null) {
          double credit = Math.min(o.durationS(), Math.max(0, p.need.exposureS() - p.exposureS));
          collected += p.unitValue / p.request.durationS() * credit;
          p.exposureS += o.durationS();
        } else {
          double value = p.request.isFlexible() ? (o.value() == null ? 0 : o.value()) : p.unitValue;
          collected += value;
          shortfall += p.unitValue - value;
        }
        p.visits++;
      }
      collectedTotal += collected;
      executedTotal += log.executed().observations().size();
      failedTotal += log.failedAttempts();
      replanTotal += log.replans();
      records.add(new NightRecord(strategy.label(), i + 1, date, w.start(), w.end(), log.cloudS(), open,
          log.firstStatus().name(), log.plannedPriority(), log.executed().observations().size(), log.failedAttempts(),
          log.replans(), collected, collectedTotal, remaining(progress), completed(progress), slew,
          (System.nanoTime() - n0) * 1e-9));
    }
    return new CampaignResult(strategy.label(), records, programme, collectedTotal, remaining(progress), shortfall,
        progress.size(), completed(progress), executedTotal, failedTotal, replanTotal, (System.nanoTime() - t0) * 1e-9);
  }

  /** The request as offered tonight (aged priority, windows clipped), or null when its windows miss the night. */
  private Request tonight(Progress p, TimeWindow night, int i) {
    Request r = p.request;
    if (!r.windows().isEmpty()) {
      List<TimeWindow> clipped = new ArrayList<>();
      for (TimeWindow x : r.windows()) {
        Instant a = x.start().isAfter(night.start()) ? x.start() : night.start();
        Instant b = x.end().isBefore(night.end()) ? x.end() : night.end();
        if (b.isAfter(a)) {
          clipped.add(new TimeWindow(a, b));
        }
      }
      if (clipped.isEmpty()) {
        return null;
      }
      r = r.withWindows(clipped);
    }
    if (!r.isFlexible() && campaign.priorityAgeingPerNight() > 0) {
      int waited = i - p.lastVisit - 1;
      double aged = Math.min(Task.MAX_PRIORITY, r.priority() * (1 + campaign.priorityAgeingPerNight() * waited));
      r = new Request(r.id(), r.target(), r.durationS(), aged, r.required(), r.windows(), r.flexible(), r.constraints());
    }
    return r;
  }

  private static double remaining(List<Progress> progress) {
    return progress.stream().mapToDouble(Progress::remaining).sum();
  }

  private static int completed(List<Progress> progress) {
    return (int) progress.stream().filter(Progress::complete).count();
  }
}
