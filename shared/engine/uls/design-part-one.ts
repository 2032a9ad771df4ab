/** The member design before part 2 adds its results: what the ULS, SLS and site modules read. */
import type { Design } from '../design/member'

export type PartTwoKey = 'uls' | 'deflection' | 'cracking' | 'site'

export type DesignPartOne = Omit<Design, PartTwoKey>
