// The users feature as other features see it: import from here, never from its files.
export { User } from './model';
export { activePeople, findPeople, findPerson, lockPerson, namesOf } from './people';
export { type UserService, getPublicUser } from './service';
