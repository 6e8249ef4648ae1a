// GetDP problem text the field models share: the Jacobian (planar or axisymmetric) with a 4-point Gauss rule on
// triangles, the space of the vector potential's perpendicular component (a = 0 where the Dirichlet constraint
// says), and the magnetostatic formulation with a source current density js[] in the given group.

export const jacobianAndIntegration = (jacobian: 'Vol' | 'VolAxiSqu') =>
  `Jacobian { { Name Vol; Case { { Region All; Jacobian ${jacobian}; } } } }
Integration { { Name Gauss4; Case { { Type Gauss; Case { { GeoElement Triangle; NumberOfPoints 4; } } } } } }`;

export const VECTOR_POTENTIAL_SPACE = `  { Name Hcurl_a; Type Form1P;
    BasisFunction { { Name se; NameOfCoef ae; Function BF_PerpendicularEdge; Support Domain; Entity NodesOf[All]; } }
    Constraint { { NameOfCoef ae; EntityType NodesOf; NameOfConstraint Dirichlet; } }
  }`;

export const magnetostaticFormulation = (sources: string) => `  { Name Magnetostatic; Type FemEquation;
    Quantity { { Name a; Type Local; NameOfSpace Hcurl_a; } }
    Equation {
      Galerkin { [ nu[] * Dof{d a}, {d a} ]; In Domain; Jacobian Vol; Integration Gauss4; }
      Galerkin { [ -js[], {a} ]; In ${sources}; Jacobian Vol; Integration Gauss4; }
    }
  }`;

/** Solve, then the stored energy ½·ν·|B|² over the domain printed to `{folder}/energy.txt` (post-operation "Energy"). */
export const MAGNETOSTATIC_ENERGY = `Resolution { { Name Magnetostatic; System { { Name S; NameOfFormulation Magnetostatic; } } Operation { Generate[S]; Solve[S]; SaveSolution[S]; } } }
PostProcessing { { Name Fields; NameOfFormulation Magnetostatic;
  Quantity { { Name energy; Value { Integral { [ 0.5 * nu[] * SquNorm[{d a}] ]; In Domain; Jacobian Vol; Integration Gauss4; } } } } } }
PostOperation { { Name Energy; NameOfPostProcessing Fields; Operation { Print[ energy[Domain], OnGlobal, Format Table, File "{folder}/energy.txt" ]; } } }`;
