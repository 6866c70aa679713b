import { fixed, formatHours, formatMoney, formatSignificant, formatTemperature, formatThickness, significant } from './format';

describe('result formatting', () => {
  it('when a temperature is shown, then it has one decimal and the unit of the system', () => {
    expect(formatTemperature(56.54, 'SI').text).toBe('56.5 °C');
    expect(formatTemperature(100, 'US').text).toBe('212.0 °F');
    expect(formatTemperature(-0.04, 'SI').value).toBe('0.0');
    expect(formatTemperature(-12.25, 'SI').value).toBe('−12.3');
    expect(formatTemperature(56.5, 'SI').spoken).toBe('56.5 degrees Celsius');
  });

  it('when heat loss is shown, then it has three significant figures', () => {
    expect(formatSignificant('heatLossPerLength', 98.2345, 'SI').text).toBe('98.2 W/m');
    expect(formatSignificant('heatLossPerLength', 1234.5, 'SI').value).toBe('1,230');
    expect(formatSignificant('heatFlow', 0.012345, 'SI').value).toBe('0.0123');
    expect(formatSignificant('heatLossPerLength', 9.996, 'SI').value).toBe('10.0');
    expect(significant(-98.25)).toBe('−98.3');
  });

  it('when a thickness is shown, then it is whole millimetres or eighths of an inch', () => {
    expect(formatThickness(0.06, 'SI').text).toBe('60 mm');
    expect(formatThickness(0.0524, 'SI').text).toBe('52 mm');
    expect(formatThickness(0.0508, 'US').text).toBe('2 in');
    expect(formatThickness(0.06, 'US').text).toBe('2⅜ in');
    expect(formatThickness(0.0127, 'US').text).toBe('½ in');
    expect(formatThickness(0.0127, 'US').spoken).toBe('one half inches');
  });

  it('when money is shown, then it has cents and the currency', () => {
    expect(formatMoney(1234.567, 'USD').text).toBe('$1,234.57');
    expect(formatMoney(-5, 'EUR').text).toBe('−€5.00');
  });

  it('when hours and fixed figures are shown, then separators and decimals are right', () => {
    expect(formatHours(12.345).text).toBe('12.3 h');
    expect(fixed(1234567.891, 2)).toBe('1,234,567.89');
  });
});
