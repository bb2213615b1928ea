export { CircuitsView, type CircuitCardData } from "./components/circuits-view";
export { circuitChart, logTicks, type CircuitChart } from "./chart-data";
