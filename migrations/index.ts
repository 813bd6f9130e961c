// Every migration, in order. Knex loads them through this list (a folder of .ts files
// cannot be required under vitest); tests/unit/migrations.test.ts keeps it complete.
import type { Knex } from 'knex';
import * as createUsers from './20261201000100_create_users.ts';
import * as createSessions from './20261201000200_create_sessions.ts';
import * as createUserTokens from './20261201000300_create_user_tokens.ts';
import * as createAuditEvents from './20261201000400_create_audit_events.ts';
import * as createApiKeys from './20261201000500_create_api_keys.ts';
import * as createIdempotencyKeys from './20261201100100_create_idempotency_keys.ts';
import * as createRequestLog from './20261201100200_create_request_log.ts';
import * as createInstruments from './20261201200100_create_instruments.ts';
import * as createMethods from './20261201200200_create_methods.ts';
import * as createImportProfiles from './20261201300100_create_import_profiles.ts';
import * as createImports from './20261201400100_create_imports.ts';
import * as createSamples from './20261201400200_create_samples.ts';
import * as createBurns from './20261201400300_create_burns.ts';
import * as createEvents from './20261201500100_create_events.ts';
import * as createReferenceMaterials from './20261201500200_create_reference_materials.ts';
import * as createStandardizations from './20261201500300_create_standardizations.ts';
import * as addMethodsDriftLimits from './20261201500400_add_methods_drift_limits.ts';
import * as addSamplesCorrection from './20261201500500_add_samples_correction.ts';
import * as addBurnsCorrection from './20261201500600_add_burns_correction.ts';
import * as addEventsSequence from './20261201800100_add_events_sequence.ts';
import * as createWebhookEndpoints from './20261201800200_create_webhook_endpoints.ts';
import * as createWebhookDeliveries from './20261201800300_create_webhook_deliveries.ts';
import * as createGradeVersions from './20261202200100_create_grade_versions.ts';
import * as addSamplesConformance from './20261202200200_add_samples_conformance.ts';
import * as addSamplesRelease from './20261202200300_add_samples_release.ts';
import * as createSampleRevisions from './20261202200400_create_sample_revisions.ts';
import * as addMethodsReporting from './20261202300100_add_methods_reporting.ts';
import * as addWebhookDeliveriesClaims from './20261203200100_add_webhook_deliveries_claims.ts';
import * as createInstrumentFeeds from './20261203300100_create_instrument_feeds.ts';
import * as createControlSamples from './20261203400100_create_control_samples.ts';
import * as createControlLimits from './20261203400200_create_control_limits.ts';
import * as createControlPoints from './20261203400300_create_control_points.ts';
import * as createControlStatusChanges from './20261203400400_create_control_status_changes.ts';
import * as createAlertPreferences from './20261203400500_create_alert_preferences.ts';
import * as createPendingAlerts from './20261203400600_create_pending_alerts.ts';
import * as createNodeCoordination from './20261203500100_create_node_coordination.ts';
import * as addInstrumentFeedsStaleAlert from './20261203500200_add_instrument_feeds_stale_alert.ts';
import * as addSamplesPreparedDocuments from './20261203600100_add_samples_prepared_documents.ts';
import * as addStandardizationsSourceFile from './20261203600100_add_standardizations_source_file.ts';
import * as createSampleFieldDefinitions from './20261203600100_create_sample_field_definitions.ts';
import * as addRequestLogFromConsole from './20261203613100_add_request_log_from_console.ts';

export interface Migration {
  up(knex: Knex): Promise<void>;
  down(knex: Knex): Promise<void>;
}

export const migrations: Record<string, Migration> = {
  '20261201000100_create_users': createUsers,
  '20261201000200_create_sessions': createSessions,
  '20261201000300_create_user_tokens': createUserTokens,
  '20261201000400_create_audit_events': createAuditEvents,
  '20261201000500_create_api_keys': createApiKeys,
  '20261201100100_create_idempotency_keys': createIdempotencyKeys,
  '20261201100200_create_request_log': createRequestLog,
  '20261201200100_create_instruments': createInstruments,
  '20261201200200_create_methods': createMethods,
  '20261201300100_create_import_profiles': createImportProfiles,
  '20261201400100_create_imports': createImports,
  '20261201400200_create_samples': createSamples,
  '20261201400300_create_burns': createBurns,
  '20261201500100_create_events': createEvents,
  '20261201500200_create_reference_materials': createReferenceMaterials,
  '20261201500300_create_standardizations': createStandardizations,
  '20261201500400_add_methods_drift_limits': addMethodsDriftLimits,
  '20261201500500_add_samples_correction': addSamplesCorrection,
  '20261201500600_add_burns_correction': addBurnsCorrection,
  '20261201800100_add_events_sequence': addEventsSequence,
  '20261201800200_create_webhook_endpoints': createWebhookEndpoints,
  '20261201800300_create_webhook_deliveries': createWebhookDeliveries,
  '20261202200100_create_grade_versions': createGradeVersions,
  '20261202200200_add_samples_conformance': addSamplesConformance,
  '20261202200300_add_samples_release': addSamplesRelease,
  '20261202200400_create_sample_revisions': createSampleRevisions,
  '20261202300100_add_methods_reporting': addMethodsReporting,
  '20261203200100_add_webhook_deliveries_claims': addWebhookDeliveriesClaims,
  '20261203300100_create_instrument_feeds': createInstrumentFeeds,
  '20261203400100_create_control_samples': createControlSamples,
  '20261203400200_create_control_limits': createControlLimits,
  '20261203400300_create_control_points': createControlPoints,
  '20261203400400_create_control_status_changes': createControlStatusChanges,
  '20261203400500_create_alert_preferences': createAlertPreferences,
  '20261203400600_create_pending_alerts': createPendingAlerts,
  '20261203500100_create_node_coordination': createNodeCoordination,
  '20261203500200_add_instrument_feeds_stale_alert': addInstrumentFeedsStaleAlert,
  '20261203600100_add_samples_prepared_documents': addSamplesPreparedDocuments,
  '20261203600100_add_standardizations_source_file': addStandardizationsSourceFile,
  '20261203600100_create_sample_field_definitions': createSampleFieldDefinitions,
  '20261203613100_add_request_log_from_console': addRequestLogFromConsole,
};
