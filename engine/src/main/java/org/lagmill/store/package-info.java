/**
 * The compact sales store: per-series narrow unit columns (1, 2 or 4 bytes chosen from the series' largest value),
 * dictionary-encoded attributes, price change points and a day-aligned calendar, memory-mapped off-heap.
 *
 * <p>Entry points: {@link org.lagmill.store.SalesHistory} (the read view every later stage uses) and
 * {@link org.lagmill.store.SalesStore} (open a store directory), and for writers
 * {@link org.lagmill.store.StoreUpdate} (the lock and the commit of a new generation, see
 * {@link org.lagmill.store.StoreGenerations}). Depends on {@code memory} and {@code io}; agrona stays inside.
 */
package org.lagmill.store;
