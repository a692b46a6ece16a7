// The plant feature as other features see it: import from here, never from its files.
export { type PlantUnit } from './model';
export { allStations, allUnits, allVersionsOf, countCrewsOfStation, crewNamesOf, findCrew, findEquipment, findStation, findUnit, firstStation, limitSetsById, lockUnit, unitIdsOfStation } from './service';
export { designInForce, designInForceOrNone, limitVersionsUpTo, limitsInForce, plausibleInForce, requireUnit, unjudgedReason, versionStarts } from './versions';
