// Shared by the thermal unit tests: an invented 1200 V / 450 A switch-diode module with figures at 150 °C only
// (no temperature dependence), and a stiff heatsink at 60 °C. Invented data, for the tests only.
import type { DynamicsPart } from '../../../shared/thermal/dynamics'

export const inventedModule: DynamicsPart = {
  switchThresholdVoltage: 0.9, switchSlopeResistance: 2.6e-3, diodeThresholdVoltage: 0.95, diodeSlopeResistance: 1.9e-3,
  turnOnEnergy: 38e-3, turnOffEnergy: 52e-3, recoveryEnergy: 24e-3, energyReferenceVoltage: 600, energyReferenceCurrent: 450,
  rthJunctionCaseSwitch: 0.065, rthJunctionCaseDiode: 0.11, rthCaseHeatsink: 0.02, junctionTemperatureMax: 175, lossDataTemperature: 150,
  zthSwitchR1: 0.006, zthSwitchTau1: 0.0008, zthSwitchR2: 0.02, zthSwitchTau2: 0.012, zthSwitchR3: 0.03, zthSwitchTau3: 0.06, zthSwitchR4: 0.009, zthSwitchTau4: 0.4,
}

export const stiffCooling = { ambientTemperatureC: 60, heatsinkRth: 0, heatsinkTimeConstantS: 300 }
