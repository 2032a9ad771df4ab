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
export * from './uls/bending'
export * from './uls/shear'
export * from './uls/punching'
export * from './uls/reinforcement'
export * from './loads/uls-combinations'
export * from './sls/deflection'
export * from './sls/cracked-section'
export * from './sls/cracking'
export * from './site/tendon-heights'
export * from './site/stressing'
