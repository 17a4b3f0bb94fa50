/**
 * Off-heap memory ownership: the {@link org.lagmill.memory.MemoryBudget} tree every owner of native or mapped bytes
 * reserves from, and the small owned buffers built on it. Depends on nothing in lagmill; agrona may be used here.
 */
package org.lagmill.memory;
