/**
 * The public surface of the engine: every name the engine exported before its member design was
 * split into stages is still exported by index.ts (outside code — the report, the server, the app —
 * imports them), and the stage functions are exported beside designMember.
 */
import { describe, expect, it } from 'vitest'
import * as engine from '../../../shared/engine/index'
import * as crackSteel from '../../../shared/engine/sls/crack-control-steel'
// the type names: tsc (tsconfig.engine.json) rejects this import if one of them is missing
import type {
  BalancingForce, BarLayer, BeamLoad, BendingInput, BendingResult, CementClass, CheckResult, ColumnPosition,
  Combination, ConcreteAtAge, ConcreteClass, ConcreteProperties, ContinuousBeamInput, ContinuousBeamResult,
  CrackExposure, CrackRequirement, CrackWidthInput, CrackWidthResult, CrackedSectionInput, CrackedSectionResult,
  CreepInput, CriticalSection, DecompressionInput, DecompressionResult, DeflectionInput, DeflectionResult, Design,
  DesignBranch, DesignOptions, DrawInResult, DuctKind, ExposureClass, Fibre, FibrePair, FibreStresses, FieldMeta,
  HeightPointKind, HeightRow, InputFieldSpec, InputGroup, InputPatch, JackingLimits, LayerState, LossItem,
  MagnelCondition, MagnelInput, MagnelLine, MagnelResult, MagnelSection, MeasuredCheck, MeasuredExtension,
  MemberInput, MemberInputDraft, MomentRange, PrestressMoments, PrestressMomentsInput, ProfilePiece, Proposal,
  PunchingInput, PunchingResult, QuantitySpec, ReinforcementLimits, ReinforcementLimitsInput, SectionGeometry,
  SectionKind, SectionOutline, SectionProperties, ServiceCombination, ShearInput, ShearResult, ShrinkageInput,
  ShrinkageResult, SpanCracking, SpanDeflection, Stage, StageLimits, SteelLayer, Strand, StrandType, StressEnvelope,
  StressingEnds, StressingInput, StressingSchedule, StressingTendon, SupportKind, SupportSteel, SupportSteelInput,
  TendonEnd, TendonHeightInput, TendonHeightSchedule, TendonLayer, TendonProfile, TendonSchedule, TensionRule,
  TimeDependentInput, TimeDependentParts, UlsCase, UlsFactors, UlsRule,
} from '../../../shared/engine/index'


const VALUES = [
  'CONCRETE_CLASSES', 'CRACK_EXPOSURE_CLASSES', 'DEMO_BB1', 'DEMO_PS2', 'ENGINE_VERSION', 'EXPOSURE_CLASSES',
  'EngineInputError', 'INPUT_GROUPS', 'INPUT_SPECS', 'PUNCHING_BETA', 'RESULT_SPECS', 'RHO1000', 'STAGES', 'STRANDS',
  'SUPPORT_STEEL_RULE', 'ULS_FACTORS', 'alphaCw', 'analyseContinuousBeam', 'balancedLoad', 'balancingForce',
  'barDesignStress', 'bendingResistance', 'bondRatioStrand', 'cementS', 'compressionUtilisation', 'concreteAtAge',
  'concreteProperties', 'controlPerimeters', 'crackRequirement', 'crackWidth', 'crackedSection', 'creepCoefficient',
  'decompressionCheck', 'deflectionFromCurvature', 'designMember', 'distributionCoefficient', 'drapes',
  'drawInForces', 'drawInLength', 'eccentricityIn', 'elasticShorteningLoss', 'equivalentLoads', 'fibreStresses',
  'frictionForce', 'grossArea', 'inputFieldSpecs', 'inputSpecsList', 'interpolate', 'jackingLimits', 'khFactor',
  'lowPointFraction', 'magnel', 'magnelLine', 'magnelRegion', 'memberDeflection', 'memberInputSchema',
  'memberInputShape', 'mergeInputPatch', 'nominalWebWidth', 'parseMemberInput', 'prestressMoments', 'punchingCheck',
  'reinforcementLimits', 'relaxationLoss', 'requiredModuli', 'resolveProfile', 'sectionHeight', 'sectionProperties',
  'shearResistance', 'shrinkageStrain', 'slopeIn', 'spanPieces', 'specFor', 'stressBlock', 'stressingSchedule',
  'supportBondedSteel', 'tendonDesignStress', 'tendonEccentricity', 'tendonHeightSchedule', 'tendonSlope',
  'tensionRules', 'tensionUtilisation', 'tensionZoneSteel', 'timeDependentLoss', 'timeDependentParts',
  'ulsLoadCases', 'validateUlsFactors',
]

const STAGE_FUNCTIONS = [
  'designMember', 'sectionStage', 'loadsStage', 'profileStage', 'balancingStage', 'lossesStage', 'analysisStage',
  'stressesStage', 'magnelStage', 'proposalStage', 'ulsStage', 'slsStage', 'siteStage',
]

describe('public surface of shared/engine', () => {
  it('keeps every value name exported before the stages', () => {
    const missing = VALUES.filter((n) => !(n in engine))
    expect(missing).toEqual([])
  })
  it('adds the pattern loading, the local equivalent loads and the ULS expressions', () => {
    for (const n of ['patternLoading', 'quantityOf', 'equivalentLoadsOfSpans', 'ulsExpressions', 'ulsCaseNames', 'steelStressForBarSize']) expect(n in engine, n).toBe(true)
  })
  it('exports the eq. (7.1) minimum crack steel and its helpers as the module\'s own functions', () => {
    const names = ['crackSizeFactor', 'kcWeb', 'kcFlange', 'tensileDepthAtCracking', 'bondRatioPostTensioned', 'tendonEquivalentDiameter',
      'bondAdjustedRatio', 'minimumCrackSteel', 'maxBarDiameterTable', 'maxBarSpacing', 'maxBarDiameter'] as const
    for (const n of names) expect((engine as Record<string, unknown>)[n], n).toBe((crackSteel as Record<string, unknown>)[n])
  })
  it('exports designMember and every stage as a function', () => {
    for (const n of STAGE_FUNCTIONS) expect(typeof (engine as Record<string, unknown>)[n], n).toBe('function')
  })
  it('exports no name that refers to a part of the work', () => {
    expect(Object.keys(engine).filter((n) => /part ?(one|two|[0-9])|phase/i.test(n))).toEqual([])
  })
})
