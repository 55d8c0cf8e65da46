// Wires the models together once; import this module before using any model's associations.
import { Farm } from './farm.ts';
import { FarmContact } from './farm-contact.ts';
import { Field } from './field.ts';

Farm.hasMany(FarmContact, { as: 'contacts', foreignKey: 'farmId' });
FarmContact.belongsTo(Farm, { foreignKey: 'farmId' });
Farm.hasMany(Field, { as: 'fields', foreignKey: 'farmId' });
Field.belongsTo(Farm, { as: 'farm', foreignKey: 'farmId' });

export const modelsReady = true;
