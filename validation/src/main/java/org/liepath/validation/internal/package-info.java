/** Implementation detail of the validation module (Hermitian spectra, table formatting); not part of the API. */
package org.liepath.validation.internal;
