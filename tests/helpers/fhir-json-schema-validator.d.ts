// The package ships JavaScript only; this is the part of its API the tests use.
declare module '@asymmetrik/fhir-json-schema-validator' {
  export default class JSONSchemaValidator {
    constructor(schema?: object, ajvSettings?: object);
    validate(resource: object, verbose?: boolean): Array<{ dataPath?: string; message?: string } | string>;
  }
}
