// The demo company's designs (invented duties, plausible figures).
import type { DesignInput } from '#shared/engine/types'

export const demoDesigns: { name: string, description: string, owner: string, input: DesignInput }[] = [
  {
    name: 'Pump drive 690 V / 400 kW',
    description: 'Three-level NPC for a 690 V water-pump motor; regenerative stop.',
    owner: 'engineer@example.com',
    input: {
      machineSide: {
        topology: 'diode-clamped', levels: 3, dcVoltage: 1100, dcVoltageMax: 1250, switchingHz: 3000, modulation: 'space-vector', overshootVoltage: 120,
        operatingPoints: [
          { name: 'Rated motoring', lineVoltageRms: 690, phaseCurrentRms: 390, powerFactor: 0.86, fundamentalHz: 50 },
          { name: 'Regenerative braking', lineVoltageRms: 690, phaseCurrentRms: 300, powerFactor: -0.8, fundamentalHz: 50 },
          { name: 'Low-frequency start', lineVoltageRms: 70, phaseCurrentRms: 450, powerFactor: 0.3, fundamentalHz: 5 },
        ],
      },
    },
  },
  {
    name: 'Dynamometer 400 V / 110 kW, back-to-back',
    description: 'Two-level machine and grid converters on one DC link; feeds braking power back to the grid.',
    owner: 'engineer@example.com',
    input: {
      machineSide: {
        topology: 'two-level', levels: 2, dcVoltage: 650, dcVoltageMax: 750, switchingHz: 8000, modulation: 'space-vector', overshootVoltage: 80,
        operatingPoints: [
          { name: 'Rated motoring', lineVoltageRms: 400, phaseCurrentRms: 190, powerFactor: 0.88, fundamentalHz: 87 },
          { name: 'Absorbing (generating)', lineVoltageRms: 400, phaseCurrentRms: 190, powerFactor: -0.88, fundamentalHz: 87 },
        ],
      },
      gridSide: {
        topology: 'two-level', levels: 2, dcVoltage: 650, dcVoltageMax: 750, switchingHz: 6000, modulation: 'space-vector', overshootVoltage: 80,
        operatingPoints: [
          { name: 'Grid, rectifying', lineVoltageRms: 400, phaseCurrentRms: 170, powerFactor: -1, fundamentalHz: 50 },
          { name: 'Grid, feeding back', lineVoltageRms: 400, phaseCurrentRms: 170, powerFactor: 1, fundamentalHz: 50 },
        ],
      },
    },
  },
  {
    name: 'MV fan drive 3.3 kV / 1.2 MW',
    description: 'Cascaded H-bridge, four 900 V cells per phase.',
    owner: 'engineer@example.com',
    input: {
      machineSide: {
        topology: 'cascaded-h-bridge', levels: 9, dcVoltage: 900, dcVoltageMax: 1000, switchingHz: 600, modulation: 'sine', overshootVoltage: 100,
        operatingPoints: [
          { name: 'Rated', lineVoltageRms: 3300, phaseCurrentRms: 230, powerFactor: 0.9, fundamentalHz: 50 },
          { name: 'Half speed', lineVoltageRms: 1650, phaseCurrentRms: 120, powerFactor: 0.8, fundamentalHz: 25 },
        ],
      },
    },
  },
  {
    name: 'Battery inverter 1500 V / 630 kVA',
    description: 'T-type grid inverter for a containerised battery; charges and discharges.',
    owner: 'admin@example.com',
    input: {
      machineSide: {
        topology: 't-type', levels: 3, dcVoltage: 1300, dcVoltageMax: 1500, switchingHz: 4000, modulation: 'space-vector', overshootVoltage: 100,
        operatingPoints: [
          { name: 'Discharging', lineVoltageRms: 690, phaseCurrentRms: 527, powerFactor: 0.95, fundamentalHz: 50 },
          { name: 'Charging', lineVoltageRms: 690, phaseCurrentRms: 527, powerFactor: -0.95, fundamentalHz: 50 },
        ],
      },
    },
  },
]
