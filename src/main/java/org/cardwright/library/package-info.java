/**
 * Model libraries: a folder tree of device files (one YAML file per part: model name, device kind, data files
 * with their conditions, parameter rules, dialects, verification tolerances), built into cards with their
 * provenance, and checked against their data. The YAML library (Jackson) is used in this package only.
 *
 * <p>See docs/device-files.md for the device-file format and docs/library.md for build, tweak and check.
 */
package org.cardwright.library;
