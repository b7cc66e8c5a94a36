/**
 * Units: conversion factors with their sources, the one grammar of quantities with units (plan file
 * and command line), the number formatters and the two display systems. A leaf module: it imports
 * nothing else from the project, and physics, plan, report and cli import it.
 */
export * from "./display.js";
export * from "./factors.js";
export * from "./format.js";
export * from "./kinds.js";
export * from "./parse.js";
