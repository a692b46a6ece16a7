// The users feature as other features see it: import from here, never from its files.
export { activePeople, findPeople, findPerson, lockPerson, namesOf, peopleOnCrewsOrIds } from './people';
export { type UserService, getPublicUser } from './service';
