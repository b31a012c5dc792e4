/** Implementation of the validation module: tables, plotting helpers. Not API. */
package org.liepath.validation.internal;
