/**
 * Tendonbook design engine (EN 1992-1-1), public surface. Pure TypeScript with relative imports.
 * Units: N, mm, MPa, N/mm (= kN/m), N·mm. Signs: sagging moment +, gravity loads + (down),
 * reactions + (up), tendon eccentricity + below the centroid, concrete stress + in compression,
 * tension limits as positive magnitudes, couples + counter-clockwise.
 */
export * from './contract'
export * from './version'
export * from './materials/concrete'
export * from './materials/creep-shrinkage'
export * from './materials/strand'
export * from './analysis/continuous-beam'
export * from './prestress/profile'
export * from './prestress/equivalent-loads'
export * from './prestress/secondary'
export * from './prestress/losses'
export * from './checks/stresses'
export * from './checks/magnel'
export * from './section'
export * from './schema'
export * from './design/patch'
export * from './design/member'
export * from './catalogue'
export * from './demo'
