/** Reported in every heartbeat and log line; raise it with each change to the agent. */
export const AGENT_VERSION = '0.1.0';
