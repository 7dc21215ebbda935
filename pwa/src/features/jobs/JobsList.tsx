/** Every visit, with a stage filter and search (placeholder until the list is built). */
export default function JobsList() {
  return <p>No jobs yet.</p>;
}
