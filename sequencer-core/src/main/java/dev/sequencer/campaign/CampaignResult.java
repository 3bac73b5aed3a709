package dev.sequencer.campaign;

import java.util.List;

/**
 * A season played by one strategy: every night in order and the totals. {@code programmeValue}: the value
 * of the whole programme at the start (each visit of a request worth its priority, or for a flexible
 * request its value at the longest exposure; an exposure need worth the priority per {@code durationS}
 * of exposure); {@code collected}: value earned; {@code remaining}: value still needed at the end;
 * {@code shortfall}: value flexible visits did not earn because they were shorter than the longest
 * exposure. They add up: collected + remaining + shortfall = programmeValue.
 */
public record CampaignResult(String strategy, List<NightRecord> nights, double programmeValue, double collected,
    double remaining, double shortfall, int requests, int completed, int executed, int failedAttempts,
    int replans, double wallS) {
  public CampaignResult {
    nights = List.copyOf(nights);
  }
}
