/**
 * A serialisable catalogue of every material parameter set with its citation, for listings such
 * as the API's materials endpoint.
 */
import { PHYSICS_DEFAULTS } from './defaults';
import type { DensityOfStatesSetId, MobilityModelId } from './defaults';
import { METALS } from './metal/metals';
import type { MetalReference } from './metal/metals';
import { VARSHNI_PARAMETERS } from './semiconductor/band-gap';
import { DENSITY_OF_STATES_SETS } from './semiconductor/density-of-states';
import { DOPANTS } from './semiconductor/dopants';
import { mergeDensityCm3 } from './semiconductor/ionization';
import type { Citation, SemiconductorId } from './semiconductor/material';
import { SEMICONDUCTORS, SEMICONDUCTOR_NAMES } from './semiconductor/material';
import { ARORA_1982_SILICON, CAUGHEY_THOMAS_SETS } from './semiconductor/mobility';

/** Catalogue entry of one semiconductor. */
export interface SemiconductorCatalogueEntry {
  id: SemiconductorId;
  name: string;
  bandGap: {
    eg0Ev: number;
    alphaEvPerK: number;
    betaK: number;
    fittedRangeK: [number, number];
    source: Citation;
  };
  densityOfStatesSets: Array<{
    id: DensityOfStatesSetId;
    description: string;
    nc300: number;
    ncExponent: number;
    nv300: number;
    nvExponent: number;
    source: Citation;
    isDefault: boolean;
  }>;
  mobilityModels: Array<{
    id: MobilityModelId;
    parameters: unknown;
    source: Citation;
    isDefault: boolean;
  }>;
  donors: Array<{ name: string; levelEv: number; isDefault: boolean }>;
  acceptors: Array<{ name: string; levelEv: number; isDefault: boolean }>;
  dopantSource: Citation;
  /**
   * Density at which the default donor and acceptor merge with the band under the default
   * ionization model (`mergeDensityCm3`), cm^-3.
   */
  mottDensityCm3: { donor: number; acceptor: number };
}

/** The full catalogue. */
export interface MaterialCatalogue {
  semiconductors: SemiconductorCatalogueEntry[];
  metals: MetalReference[];
}

const ARORA_SOURCE: Citation = {
  label: 'Arora, Hauser & Roulston 1982',
  reference: 'IEEE Trans. Electron Devices 29, 292 (1982)',
};

/**
 * Lists materials, dopants with their levels, density-of-states and mobility parameter sets and
 * metal reference data, each with its citation and default flag. Plain data (JSON-safe), built
 * from the same tables the models use, so the listing cannot drift from the computation.
 *
 * @example listMaterials().semiconductors[0].id // 'Si'
 */
export function listMaterials(): MaterialCatalogue {
  const semiconductors = SEMICONDUCTORS.map((id): SemiconductorCatalogueEntry => {
    const dopants = DOPANTS[id];
    const defaultModel = PHYSICS_DEFAULTS.mobilityModel[id];
    const models: SemiconductorCatalogueEntry['mobilityModels'] = [];
    if (id === 'Si')
      models.push({
        id: 'arora-1982',
        parameters: ARORA_1982_SILICON,
        source: ARORA_SOURCE,
        isDefault: defaultModel === 'arora-1982',
      });
    const ct = CAUGHEY_THOMAS_SETS[id];
    models.push({
      id: 'caughey-thomas-ideal',
      parameters: { electron: ct.electron, hole: ct.hole, latticeExponent: -1.5 },
      source: ct.source,
      isDefault: defaultModel === 'caughey-thomas-ideal',
    });
    return {
      id,
      name: SEMICONDUCTOR_NAMES[id],
      bandGap: { ...VARSHNI_PARAMETERS[id] },
      densityOfStatesSets: Object.values(DENSITY_OF_STATES_SETS)
        .filter((s) => s.values[id])
        .map((s) => ({
          id: s.id,
          description: s.description,
          ...s.values[id]!,
          source: s.source,
          isDefault: PHYSICS_DEFAULTS.densityOfStatesSet[id] === s.id,
        })),
      mobilityModels: models,
      donors: Object.entries(dopants.donors).map(([name, levelEv]) => ({
        name,
        levelEv: levelEv!,
        isDefault: name === dopants.defaultDonor,
      })),
      acceptors: Object.entries(dopants.acceptors).map(([name, levelEv]) => ({
        name,
        levelEv: levelEv!,
        isDefault: name === dopants.defaultAcceptor,
      })),
      dopantSource: dopants.source,
      mottDensityCm3: {
        donor: defaultMergeDensity(id, 'donor'),
        acceptor: defaultMergeDensity(id, 'acceptor'),
      },
    };
  });
  return { semiconductors, metals: Object.values(METALS) };
}

function defaultMergeDensity(id: SemiconductorId, kind: 'donor' | 'acceptor'): number {
  const table = DOPANTS[id];
  const level =
    kind === 'donor' ? table.donors[table.defaultDonor]! : table.acceptors[table.defaultAcceptor]!;
  return mergeDensityCm3(id, PHYSICS_DEFAULTS.ionizationModel[id], level, kind);
}
