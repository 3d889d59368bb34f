export { SensorImportScreen as default } from '@/components/sensors/sensor-import-screen';
