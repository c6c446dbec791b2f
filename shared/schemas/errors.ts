import type { InvalidReadingCode } from '../domain/reading-input';
import type { ToolRefusal } from '../domain/tools';

/**
 * Every code the API answers a refusal with. The server may only throw these, and the client matches on them, so a
 * renamed code breaks the build on both sides instead of a screen at run time.
 */
export type ApiErrorCode =
  | 'airframe_on_hold'
  | 'airframe_unknown'
  | 'airframe_unserviceable'
  | 'already_revoked'
  | 'authorisation_expired'
  | 'badge_inactive'
  | 'badge_locked'
  | 'badge_taken'
  | 'board_link_already_revoked'
  | 'board_link_revoked'
  | 'board_link_unknown'
  | 'cannot_deactivate_self'
  | 'check_id_taken'
  | 'check_in_progress'
  | 'csrf_invalid'
  | 'defect_of_hold'
  | 'defect_rectified'
  | 'desk_password_not_allowed'
  | 'draft_closed'
  | 'draft_invalid'
  | 'duplicate_reading'
  | 'enrolment_expired'
  | 'enrolment_invalid'
  | 'export_too_large'
  | 'fleet_number_taken'
  | 'flights_backwards'
  | 'fluid_not_approved'
  | 'fluid_wrong_base'
  | 'forbidden'
  | 'hold_already_released'
  | 'idle_locked'
  | 'inspection_missing'
  | 'internal'
  | 'invalid_deferral'
  | 'invalid_input'
  | 'invalid_window'
  | 'kiosk_not_enrolled'
  | 'kiosk_revoked'
  | 'limits_changed'
  | 'limits_problems'
  | 'limits_version_published'
  | 'no_card'
  | 'no_desk_password'
  | 'no_draft'
  | 'no_limits'
  | 'no_work'
  | 'not_authorised'
  | 'not_found'
  | 'not_independent'
  | 'not_locked'
  | 'not_signed_in'
  | 'own_check'
  | 'own_recheck'
  | 'password_required'
  | 'photo_empty'
  | 'photo_missing'
  | 'photo_not_image'
  | 'photo_too_large'
  | 'photo_unknown'
  | 'photo_upload_malformed'
  | 'photo_upload_refused'
  | 'pilot_out_of_scope'
  | 'pin_change_required'
  | 'pin_required'
  | 'preflight_expired'
  | 'preflight_missing'
  | 'readings_missing'
  | 'registration_taken'
  | 'record_incomplete'
  | 'release_not_ready'
  | 'request_refused'
  | 'self_certification'
  | 'servicing_hides_finding'
  | 'servicing_not_a_level'
  | 'servicing_twice'
  | 'can_opened_later'
  | 'sign_in_slowed'
  | 'signed_check_immutable'
  | 'staff_inactive'
  | 'state_changed'
  | 'tag_revoked'
  | 'tag_unknown'
  | 'too_many_attempts'
  | 'tool_number_taken'
  | 'tool_unknown'
  | 'tool_already_retired'
  | ToolRefusal['code']
  | 'type_code_taken'
  | 'unknown_base'
  | 'unknown_checkpoint'
  | 'unknown_corrected_check'
  | 'unknown_type'
  | 'unsupported_media_type'
  | 'usage_backwards'
  | 'usage_jump'
  | 'usage_moved'
  | 'usage_not_after_flight'
  | 'wrong_password'
  | 'wrong_pin'
  | BodyErrorCode
  | InvalidReadingCode
  | 'invalid_reading';

/** The body parser's refusals, as the error handler names them (its type with dots turned into underscores). */
export type BodyErrorCode =
  | 'entity_parse_failed'
  | 'entity_too_large'
  | 'encoding_unsupported'
  | 'charset_unsupported'
  | 'entity_verify_failed'
  | 'request_aborted'
  | 'request_size_invalid'
  | 'stream_encoding_set'
  | 'stream_not_readable'
  | 'parameters_too_many';

/** What the client adds for an answer it could not read (never sent by the server). */
export type ClientErrorCode = 'bad_response' | 'network' | `http_${number}`;

export interface ApiError {
  code: ApiErrorCode | ClientErrorCode;
  message: string;
  issues?: { path: string; message: string }[];
  [key: string]: unknown;
}
