export function SendScreen() {
  return (
    <section>
      <p class="lead">Send the day's records to the office as CSV once you have signal. Nothing leaves the phone until you say so.</p>
      <div class="empty"><p>Nothing waiting to be sent.</p></div>
    </section>
  );
}
