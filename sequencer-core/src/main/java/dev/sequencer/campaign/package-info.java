/**
 * Seasons and sweeps: the darkness of each night ({@link dev.sequencer.campaign.DarkNights}), seeded
 * weather ({@link dev.sequencer.campaign.NightWeather}), one night executed against it with re-planning
 * after each loss ({@link dev.sequencer.campaign.NightExecutor}), a whole season carried forward night by
 * night ({@link dev.sequencer.campaign.CampaignSimulator}), and grids of runs
 * ({@link dev.sequencer.campaign.SweepRunner}) whose one run function an embedding engine (a thread pool,
 * Spark) maps over the grid. Built on the {@code planner} façade.
 */
package dev.sequencer.campaign;
