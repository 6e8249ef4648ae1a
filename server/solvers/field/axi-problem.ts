// GetDP problem text for a design's 2-D model, axisymmetric (VolAxiSqu; integrals per radian) or planar (Vol;
// integrals per metre of depth): a magnetostatic solve with each conductor's share of 1 A spread evenly over its
// copper, and a harmonic solve with every conductor massive (eddy currents free) carrying its share of 1 A peak in
// series. The voltage term of a massive conductor is σ·ur/(2π) in axisymmetry and σ·ur planar (ur then the voltage
// per metre of depth, the current the conductor's own total). In the planar model a turn's go conductor carries +I
// and its return −I (each conductor its own region with its own current constraint). The loss per conductor comes
// from its own Joule integral (in a series string each conductor's voltage includes what the others induce, so only
// the loss is its own). Outputs go to absolute paths in the run's folder.
import { REGION } from './design-model.ts';
import { jacobianAndIntegration, magnetostaticFormulation, VECTOR_POTENTIAL_SPACE } from './getdp-text.ts';

export interface ProblemConductor {
  region: number;
  /** Fraction of the 1 A winding current (turns in series: 1; n wires in hand: 1/n each). */
  share: number;
  /** Planar: +1 for a go conductor, −1 for its return (default +1). */
  direction?: 1 | -1;
  area: number;
}

export interface AxiProblem {
  permeability: number;
  conductors: ProblemConductor[];
  /** Copper conductivity (S/m) for the harmonic solve. */
  conductivity: number;
  /** Whether the model has core regions (a lone conductor in air has none). */
  hasCore: boolean;
  /** Planar (x–y, per metre of depth) instead of the body of revolution. */
  planar?: boolean;
}

const n = (x: number) => x.toPrecision(12);

export function axiProblem(p: AxiProblem): string {
  const ids = p.conductors.map((k) => k.region);
  const coreGroups = p.hasCore
    ? `Leg = Region[${REGION.leg}]; CoreRest = Region[${REGION.coreRest}]; Core = Region[{Leg, CoreRest}];`
    : 'Core = Region[{}]; Leg = Region[{}];';
  const current = (k: ProblemConductor) => k.share * (k.direction ?? 1);
  const perConductor = p.conductors.map((k) => `  js[Region[${k.region}]] = Vector[0, 0, ${n(current(k) / k.area)}];`).join('\n');
  const currents = p.conductors.map((k) => `{ Region Region[${k.region}]; Value ${n(current(k))}; }`).join(' ');
  // ur is the voltage per radian (axisymmetric) or per metre of depth (planar).
  const perU = p.planar ? '' : ' / (2*Pi)';
  const axis = p.planar ? '' : ' { Region Axis; Value 0; }';
  const joule = p.conductors
    .map((k) => `    Print[ joule[Region[${k.region}]], OnGlobal, Format Table, File > "{folder}/joule.txt" ];`)
    .join('\n');
  return `// Gapwright ${p.planar ? 'planar' : 'axisymmetric'} design model (generated)
Group {
  ${coreGroups}
  Air = Region[${REGION.air}]; Axis = Region[${REGION.axis}]; Boundary = Region[${REGION.boundary}];
  Conductors = Region[{${ids.join(', ')}}];
  Domain = Region[{Core, Air, Conductors}];
}
Function {
  mu0 = 4e-7*Pi;
  DefineConstant[ freq = 1e5 ];
  nu[Region[{Air, Conductors}]] = 1/mu0;
  ${p.hasCore ? `nu[Core] = 1/(mu0*${n(p.permeability)});` : ''}
  sigma[Conductors] = ${n(p.conductivity)};
${perConductor}
}
Constraint {
  { Name Dirichlet; Case { { Region Boundary; Value 0; }${axis} } }
  { Name Current; Case { ${currents} } }
}
${jacobianAndIntegration(p.planar ? 'Vol' : 'VolAxiSqu')}
FunctionSpace {
${VECTOR_POTENTIAL_SPACE}
  { Name Hregion_u; Type Form1P;
    BasisFunction { { Name sr; NameOfCoef ur; Function BF_RegionZ; Support Conductors; Entity Conductors; } }
    GlobalQuantity { { Name U; Type AliasOf; NameOfCoef ur; } { Name I; Type AssociatedWith; NameOfCoef ur; } }
    Constraint { { NameOfCoef I; EntityType Region; NameOfConstraint Current; } }
  }
}
Formulation {
${magnetostaticFormulation('Conductors')}
  { Name Harmonic; Type FemEquation;
    Quantity {
      { Name a; Type Local; NameOfSpace Hcurl_a; }
      { Name ur; Type Local; NameOfSpace Hregion_u; }
      { Name I; Type Global; NameOfSpace Hregion_u [I]; }
      { Name U; Type Global; NameOfSpace Hregion_u [U]; }
    }
    Equation {
      Galerkin { [ nu[] * Dof{d a}, {d a} ]; In Domain; Jacobian Vol; Integration Gauss4; }
      Galerkin { DtDof [ sigma[] * Dof{a}, {a} ]; In Conductors; Jacobian Vol; Integration Gauss4; }
      Galerkin { [ sigma[] * Dof{ur}${perU}, {a} ]; In Conductors; Jacobian Vol; Integration Gauss4; }
      Galerkin { DtDof [ sigma[] * Dof{a}, {ur} ]; In Conductors; Jacobian Vol; Integration Gauss4; }
      Galerkin { [ sigma[] * Dof{ur}${perU}, {ur} ]; In Conductors; Jacobian Vol; Integration Gauss4; }
      GlobalTerm { [ Dof{I}, {U} ]; In Conductors; }
    }
  }
}
Resolution {
  { Name Magnetostatic; System { { Name S; NameOfFormulation Magnetostatic; } } Operation { Generate[S]; Solve[S]; SaveSolution[S]; } }
  { Name Harmonic; System { { Name H; NameOfFormulation Harmonic; Type ComplexValue; Frequency freq; } }
    Operation { Generate[H]; Solve[H]; SaveSolution[H]; } }
}
PostProcessing {
  { Name Static; NameOfFormulation Magnetostatic;
    Quantity {
      { Name energy; Value { Integral { [ 0.5 * nu[] * SquNorm[{d a}] ]; In Domain; Jacobian Vol; Integration Gauss4; } } }
      { Name legFlux; Value { Integral { [ Norm[{d a}] ]; In Leg; Jacobian Vol; Integration Gauss4; } } }
      { Name legVolume; Value { Integral { [ 1 ]; In Leg; Jacobian Vol; Integration Gauss4; } } }
      { Name normB; Value { Local { [ Norm[{d a}] ]; In Domain; Jacobian Vol; } } }
      { Name az; Value { Local { [ CompZ[{a}] ]; In Domain; Jacobian Vol; } } }
    }
  }
  { Name Dynamic; NameOfFormulation Harmonic;
    Quantity {
      { Name joule; Value { Integral { [ 0.5 * sigma[] * SquNorm[ Dt[{a}] + {ur}${perU} ] ]; In Conductors; Jacobian Vol; Integration Gauss4; } } }
      { Name energy; Value { Integral { [ 0.25 * nu[] * SquNorm[{d a}] ]; In Domain; Jacobian Vol; Integration Gauss4; } } }
    }
  }
}
PostOperation {
  { Name Static; NameOfPostProcessing Static; Operation {
    Print[ energy[Domain], OnGlobal, Format Table, File "{folder}/energy.txt" ];
    ${
      p.hasCore
        ? `Print[ legFlux[Leg], OnGlobal, Format Table, File "{folder}/leg-b.txt" ];
    Print[ legVolume[Leg], OnGlobal, Format Table, File "{folder}/leg-volume.txt" ];
    Print[ normB, OnElementsOf Core, Depth 0, Format SimpleTable, File "{folder}/core-b.txt" ];`
        : ''
    }
    Print[ az, OnElementsOf Domain, Format NodeTable, File "{folder}/az.txt" ];
  } }
  { Name Dynamic; NameOfPostProcessing Dynamic; Operation {
${joule}
    Print[ energy[Domain], OnGlobal, Format Table, File "{folder}/ac-energy.txt" ];
  } }
}
`;
}
