/** Sources and units named in the Working of the exhaust side. */

/** Sources of the exhaust steps. */
export const EXHAUST_SOURCES = {
  gas: 'Products of combustion: Heywood, Internal Combustion Engine Fundamentals (1988), §4.3 (water-gas shift K = 3.5, frozen); cp from the NASA 7-coefficient polynomials (McBride, Gordon & Reno, NASA TM-4513, 1993; GRI-Mech 3.0 data)',
  gasFallback: 'Saravanamuttoo, Rogers & Cohen, Gas Turbine Theory: combustion gases γ = 1.333, cp = 1.148 kJ/(kg K) (no fuel given)',
  loss: 'Duct loss Δp ∝ ṁ²/ρ (constant loss coefficient, incompressible duct flow)',
  speed: 'Turbine map of the Plan, read between its speed lines at the shaft speed (straight line in speed)',
  turbinePower: 'NASA Glenn Research Center, compressor–turbine matching; Isermann, Combustion Engine Diagnosis (2017), eq. 5.4.17',
  swallowing: 'Turbine flow parameter FP = ṁ·√T3/p3 (definition), read from the turbine map',
  orifice: 'Compressible orifice flow: NASA Glenn Research Center, "Mass flow choking"; critical ratio from isentropic flow tables (NACA Report 1135)',
  root: "Brent's method on a bracket (Brent, Algorithms for Minimization without Derivatives, 1973)",
  turbineMap: 'Turbine map of the Plan',
} as const;

/** SI unit text of a turbine flow parameter. */
export const FP_UNIT = 'kg K^0.5/(s Pa)';
