package org.slackwater.cli;

/** What a request brought: an {@link Answer} read whole, or a {@link ServerConnection.Streamed} body still arriving. */
sealed interface Arrival permits Answer, ServerConnection.Streamed {}
