/**
 * The invented demo scenario: a deterministic generator of wide daily sales, a calendar with per-region paydays and
 * price change points for an invented grocery-and-goods chain, written straight to CSV files one series at a time.
 *
 * <p>Entry points: {@link org.lagmill.scenario.ScenarioGenerator#write} with a {@link org.lagmill.scenario.ScenarioSpec}.
 * The demand model lives in {@link org.lagmill.scenario.DemandModel} (levels, seasonality, events, paydays, promotions,
 * launches, stock-outs), prices in {@link org.lagmill.scenario.PriceSchedule}, the hierarchy in
 * {@link org.lagmill.scenario.ChainLayout} and the calendar in {@link org.lagmill.scenario.EventCalendar}.
 * Depends on nothing else in lagmill; it writes the same files a user would bring, so the rest of the pipeline reads
 * it through {@code ingest} like any other input.
 */
package org.lagmill.scenario;
