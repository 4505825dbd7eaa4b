/**
 * Version of the measurement engine stored with every analysis. Raise it whenever a change to shared/domain/analysis
 * can change a figure, flag or verdict for the same file and parameters, so stored analyses say which rules made them.
 */
export const analysisEngineVersion = '1.1.0';
