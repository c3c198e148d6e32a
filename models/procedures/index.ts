import type { ProcedureInput } from '~/lib/procedure/schema';
import { wren160Flywheel } from './wren-160-flywheel';
import { wren160Head } from './wren-160-head';
import { wren160SparkPlug } from './wren-160-spark-plug';
import { wren160Sump } from './wren-160-sump';

// The four demo procedures for the fictional Wren 160 (demo values, marked as such in each document).
export const DEMO_PROCEDURES: ProcedureInput[] = [wren160Sump, wren160Head, wren160Flywheel, wren160SparkPlug];
