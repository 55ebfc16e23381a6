// Lifetime from a mission profile: each operating point's share of the operating hours (and optional
// start / stop cycles per hour), the junction swing per point (dynamics.ts), Miner's rule across points.
//
// Power cycling (bond wire lift-off / solder fatigue of IGBT modules): R. Bayerer, T. Herrmann, T. Licht,
// J. Lutz, M. Feller, "Model for power cycling lifetime of IGBT modules — various factors influencing
// lifetime", CIPS 2008:
//   N_f = K · ΔT_j^β1 · exp(β2 / (T_j,min + 273)) · t_on^β3 · I^β4 · V^β5 · D^β6
// ΔT_j in K, T_j,min in °C, t_on the heating time in s, I the current per bond wire in A, V the chip's
// voltage class / 100 V, D the bond wire diameter in µm. The parameter values below are the ones widely
// quoted for this model, recalled from memory (not checked against the paper here): editable defaults.
// Cycles per operating point: one per fundamental period (ΔT_j the swing, t_on the time above the mean),
// plus the start / stop cycles given for the point (ΔT_j = mean T_j − ambient, t_on the time at the point
// per start).
//
// Miner's rule (linear damage accumulation, M. A. Miner, J. Appl. Mech. 1945): damage per operating hour
// D = Σ_points n_k / N_f,k; life = 1 / D operating hours.
//
// Electrolytic capacitors: L = L_rated · 2^((T_rated − T_hot-spot) / 10 K) (rated life doubling per 10 K
// lower, common practice), T_hot-spot = T_ambient + ESR·I_rms²·R_th,hot-spot per capacitor, Miner over points.

export interface BayererParameters {
  K: number
  beta1: number
  beta2: number
  beta3: number
  beta4: number
  beta5: number
  beta6: number
  /** A per bond wire */
  currentPerBondWireA: number
  /** µm */
  bondWireDiameterUm: number
}

/** From memory (the values commonly quoted for the CIPS 2008 model); the bond wire current and diameter are our assumptions. */
export const BAYERER_DEFAULTS: Readonly<BayererParameters> = {
  K: 9.3e14,
  beta1: -4.416,
  beta2: 1285,
  beta3: -0.463,
  beta4: -0.716,
  beta5: -0.761,
  beta6: -0.5,
  currentPerBondWireA: 10,
  bondWireDiameterUm: 300,
}

/** Range the model was fitted over, from memory: outside it the figure is an extrapolation (said on the result). */
export const BAYERER_RANGE = { deltaTK: [45, 150], tjMinC: [20, 120], tOnS: [1, 15] } as const

export const POWER_CYCLING_SOURCE = 'R. Bayerer, T. Herrmann, T. Licht, J. Lutz, M. Feller, "Model for power cycling lifetime of IGBT modules — various factors influencing lifetime", CIPS 2008 (parameters: editable defaults, values from memory); Miner\'s rule (M. A. Miner, 1945)'
export const CAPACITOR_LIFE_SOURCE = 'Electrolytic capacitor life doubling per 10 K below the rated temperature (common practice); hot spot = ambient + ESR·I_rms²·R_th,hot-spot; Miner\'s rule over the points'

/** Cycles to failure for one kind of cycle. */
export function cyclesToFailure(deltaTK: number, tjMinC: number, tOnS: number, voltageClassV: number, p: BayererParameters = BAYERER_DEFAULTS): number {
  if (!(deltaTK > 0)) return Infinity
  return p.K * deltaTK ** p.beta1 * Math.exp(p.beta2 / (tjMinC + 273)) * tOnS ** p.beta3
    * p.currentPerBondWireA ** p.beta4 * (voltageClassV / 100) ** p.beta5 * p.bondWireDiameterUm ** p.beta6
}

/** One operating point of the mission for one device. */
export interface MissionPoint {
  pointName: string
  /** share of the operating hours, 0…1 */
  hoursShare: number
  /** start / stop cycles per operating hour that reach this point (optional) */
  startsPerHour?: number
  /** Hz, one swing per fundamental period (0 = no fundamental cycling) */
  fundamentalHz: number
  /** K, swing over the fundamental period */
  swingK: number
  /** °C */
  minC: number
  meanC: number
  /** s, heating time of one fundamental cycle */
  heatingTimeS: number
}

export interface PointDamage {
  pointName: string
  /** damage per operating hour (Miner) */
  damagePerHour: number
  /** cycles to failure of the fundamental cycle and of the start / stop cycle (Infinity = no such cycle) */
  cyclesToFailure: number
  startCyclesToFailure: number
}

export interface DeviceLife {
  /** operating hours until Σ n/N_f = 1 (Infinity when nothing cycles) */
  lifeHours: number
  perPoint: PointDamage[]
  /** assumptions and extrapolations, one sentence each */
  notes: string[]
}

/** Power-cycling life of one device over the mission (Bayerer N_f per cycle kind, Miner across points). */
export function powerCyclingLife(points: readonly MissionPoint[], voltageClassV: number, ambientC: number, params: BayererParameters = BAYERER_DEFAULTS): DeviceLife {
  const notes = new Set<string>()
  const outside = (dT: number, tMin: number, tOn: number) => {
    if (dT < BAYERER_RANGE.deltaTK[0] || dT > BAYERER_RANGE.deltaTK[1]) notes.add(`ΔT_j outside the model's fitted ${BAYERER_RANGE.deltaTK[0]}…${BAYERER_RANGE.deltaTK[1]} K: extrapolated`)
    if (tMin < BAYERER_RANGE.tjMinC[0] || tMin > BAYERER_RANGE.tjMinC[1]) notes.add(`T_j,min outside ${BAYERER_RANGE.tjMinC[0]}…${BAYERER_RANGE.tjMinC[1]} °C: extrapolated`)
    if (tOn < BAYERER_RANGE.tOnS[0] || tOn > BAYERER_RANGE.tOnS[1]) notes.add(`heating time outside ${BAYERER_RANGE.tOnS[0]}…${BAYERER_RANGE.tOnS[1]} s: extrapolated`)
  }
  const perPoint = points.map((pt): PointDamage => {
    let damage = 0
    let nf = Infinity
    let nfStart = Infinity
    if (pt.hoursShare > 0 && pt.fundamentalHz > 0 && pt.swingK > 0) {
      nf = cyclesToFailure(pt.swingK, pt.minC, pt.heatingTimeS, voltageClassV, params)
      damage += (pt.hoursShare * 3600 * pt.fundamentalHz) / nf
      if (pt.swingK > 1) outside(pt.swingK, pt.minC, pt.heatingTimeS)
    }
    if (pt.startsPerHour && pt.startsPerHour > 0 && pt.meanC > ambientC) {
      const tOn = (pt.hoursShare * 3600) / pt.startsPerHour
      nfStart = cyclesToFailure(pt.meanC - ambientC, ambientC, tOn, voltageClassV, params)
      damage += pt.startsPerHour / nfStart
      outside(pt.meanC - ambientC, ambientC, tOn)
    }
    return { pointName: pt.pointName, damagePerHour: damage, cyclesToFailure: nf, startCyclesToFailure: nfStart }
  })
  const total = perPoint.reduce((s, p) => s + p.damagePerHour, 0)
  return { lifeHours: total > 0 ? 1 / total : Infinity, perPoint, notes: [...notes] }
}

/** Electrolytic capacitor life over the mission; `perCapacitorLossW[k]` at each point, the hours shares beside. */
export function capacitorLife(points: readonly { pointName: string, hoursShare: number, lossW: number }[], ratedLifeH: number, ratedTemperatureC: number, rthHotSpot: number, ambientC: number): { lifeHours: number, perPoint: { pointName: string, hotSpotC: number, lifeHours: number, damagePerHour: number }[] } {
  const perPoint = points.map((p) => {
    const hotSpotC = ambientC + p.lossW * rthHotSpot
    const lifeHours = ratedLifeH * 2 ** ((ratedTemperatureC - hotSpotC) / 10)
    return { pointName: p.pointName, hotSpotC, lifeHours, damagePerHour: p.hoursShare / lifeHours }
  })
  const total = perPoint.reduce((s, p) => s + p.damagePerHour, 0)
  return { lifeHours: total > 0 ? 1 / total : Infinity, perPoint }
}
