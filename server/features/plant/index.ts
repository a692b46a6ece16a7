// The plant feature as other features see it: import from here, never from its files.
export { PlantUnit } from './model';
export { allStations, allUnits, allVersionsOf, countCrewsOfStation, crewNamesOf, findCrew, findEquipment, findStation, findUnit, firstStation, limitSetsById, lockUnit } from './service';
export { designInForce, designInForceOrNone, limitVersionsUpTo, limitsInForce, plausibleInForce, requireUnit, unjudgedReason, versionStarts } from './versions';
