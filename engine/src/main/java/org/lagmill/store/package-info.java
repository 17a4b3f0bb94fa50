/**
 * The compact sales store: per-series narrow unit columns (1, 2 or 4 bytes chosen from the series' largest value),
 * dictionary-encoded attributes, price change points and a day-aligned calendar, memory-mapped off-heap.
 *
 * <p>Entry points: {@link org.lagmill.store.SalesHistory} (the read view every later stage uses) and
 * {@link org.lagmill.store.SalesStore} (open a store directory). Depends on {@code memory}; agrona stays inside.
 */
package org.lagmill.store;
