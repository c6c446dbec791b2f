import {
  aircraftTypeDefinitionSchema,
  type AircraftTypeDefinition,
  type Edge,
  type LimitBand,
} from '../schemas/limits';

const closed = (value: number): Edge => ({ value, closed: true });
const open = (value: number): Edge => ({ value, closed: false });

const band = (
  id: string,
  lower: Edge,
  upper: Edge,
  verdict: LimitBand['verdict'],
  message: string,
  action: string,
) => ({ id, lower, upper, verdict, message, action }) satisfies LimitBand;

const placeholder = 'Placeholder: replace with the approved maintenance data reference before publishing.';

/**
 * What a new aircraft type starts from: one reservoir sight glass with closed bands over the whole glass, asked by
 * every check kind. Its figures are placeholders chosen to be obviously round, not anyone's limits; engineering
 * replaces them from the type's approved maintenance data before publishing. Written for this purpose so that no
 * production path depends on the demo data.
 */
export function starterCard(code: string, name: string): AircraftTypeDefinition {
  return aircraftTypeDefinitionSchema.parse({
    code,
    name,
    fluid: { allowed: [{ spec: 'MIL-PRF-5606', base: 'mineral' }] },
    systems: [{ code: 'sys1', label: 'Hydraulic system', reservoirCheckpoint: 'sys1.level' }],
    checkpoints: [
      {
        code: 'sys1.level',
        label: 'Reservoir level',
        instruction: 'Read the reservoir sight glass.',
        kind: 'level',
        unit: 'L',
        range: { min: 0, max: 10 },
        system: 'sys1',
        marks: { minimum: 4, normal: 6, maximum: 8 },
        ata: '29',
        reference: placeholder,
        bands: [
          band(
            'below_minimum',
            closed(0),
            open(4),
            'out_of_limits',
            'Level below the minimum mark.',
            'Do not fly.',
          ),
          band('in_limits', closed(4), closed(8), 'in_limits', 'Level between the marks.', 'None.'),
          band(
            'overfilled',
            open(8),
            closed(10),
            'service',
            'Level above the maximum mark.',
            'Drain to normal.',
          ),
        ],
      },
    ],
    cards: {
      pre_flight: ['sys1.level'],
      ground_run: ['sys1.level'],
      after_flight: ['sys1.level'],
      servicing: ['sys1.level'],
    },
    validity: {
      pre_flight: { hours: 24 },
      ground_run: { flights: 1 },
      after_flight: { hours: 24 },
      servicing: { hours: 24 },
    },
    consumptionAlertLPerFh: 0.1,
    timeZone: 'UTC',
  });
}
