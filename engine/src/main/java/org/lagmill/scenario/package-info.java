/**
 * The invented demo scenario: a deterministic generator of wide daily (or weekly) sales for an invented two-banner
 * grocery chain, with a calendar of public holidays and per-district school breaks, price change points, a promotion
 * plan and outlet closures, written straight to CSV files one series at a time.
 *
 * <p>Entry points: {@link org.lagmill.scenario.ScenarioGenerator#write} with a {@link org.lagmill.scenario.ScenarioSpec}.
 * The demand model lives in {@link org.lagmill.scenario.DemandModel} (levels, seasonality, holidays, school breaks,
 * promotions, launches, openings, stock-outs), prices and promotions in
 * {@link org.lagmill.scenario.PromotionSchedule}, closures in {@link org.lagmill.scenario.ClosureSchedule}, the chain
 * in {@link org.lagmill.scenario.ChainLayout} and the calendar in {@link org.lagmill.scenario.HolidayCalendar}.
 * Depends on nothing else in lagmill; it writes the same files a user would bring, so the rest of the pipeline reads
 * it through {@code ingest} like any other input.
 */
package org.lagmill.scenario;
