/**
 * The units-only mathjs instance, in a module of its own so the web app can load it as a separate
 * chunk after the first paint (plain numbers never need it).
 */
import { create, unitDependencies, type FactoryFunctionMap, type MathJsInstance } from 'mathjs';

export type UnitParser = Pick<MathJsInstance, 'unit'>;

export function createUnitParser(): UnitParser {
  // mathjs types every *Dependencies export as possibly undefined; it is always defined.
  return create({ unitDependencies } as FactoryFunctionMap) as UnitParser;
}
